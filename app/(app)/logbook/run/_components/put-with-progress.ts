/**
 * PUTs a file to a presigned URL with XMLHttpRequest (fetch reports no upload progress). Resolves
 * with the HTTP status; rejects with "network" when the connection drops, so the caller can offer
 * a retry of the same upload.
 */
export function putWithProgress(url: string, file: Blob, contentType: string, onProgress: (fraction: number) => void): Promise<number> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("PUT", url);
    xhr.setRequestHeader("content-type", contentType);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onload = () => resolve(xhr.status);
    xhr.onerror = () => reject(new Error("network"));
    xhr.onabort = () => reject(new Error("network"));
    xhr.send(file);
  });
}
