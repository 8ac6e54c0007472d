import type { InputHTMLAttributes } from "react";

/** A labelled input with its error below, tied together for screen readers. */
export function TextField({ label, error, id, ...props }: InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; id: string }) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block font-semibold">
        {label}
      </label>
      <input
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className="block min-h-14 w-full rounded-lg border-2 border-line bg-raised px-3 text-lg text-ink"
        {...props}
      />
      {error ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
}
