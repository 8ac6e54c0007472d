"use client";

import { useState } from "react";
import { TextField } from "@/components/ui/field";
import { useEarlierFields } from "./use-earlier-fields";

type Props = {
  fieldName: string;
  onFieldName: (v: string) => void;
  position: { lat: number; lon: number } | null;
  onPosition: (p: { lat: number; lon: number } | null) => void;
  error?: string;
  /** Fields the pilot's clubs keep (offered first; naming one shows its cautions). */
  clubFieldNames?: readonly string[];
};

/**
 * Where: the field's name (the last one filled in, earlier ones offered as you type) and, if
 * wanted, the phone's position (GPS works with no signal).
 */
export function PlaceFields({ fieldName, onFieldName, position, onPosition, error, clubFieldNames = [] }: Props) {
  const [status, setStatus] = useState<string | null>(null);
  const visited = useEarlierFields();
  const earlier = [...new Map([...clubFieldNames, ...visited].map((n) => [n.toLocaleLowerCase(), n])).values()];
  const locate = () => {
    if (!("geolocation" in navigator)) return setStatus("This browser cannot give a position.");
    setStatus("Finding the position…");
    navigator.geolocation.getCurrentPosition(
      (p) => {
        onPosition({ lat: Math.round(p.coords.latitude * 1e5) / 1e5, lon: Math.round(p.coords.longitude * 1e5) / 1e5 });
        setStatus(`Within about ${Math.round(p.coords.accuracy)} m.`);
      },
      (e) => setStatus(e.code === e.PERMISSION_DENIED ? "Position not allowed: the window works without it." : "No position found: the window works without it."),
      { enableHighAccuracy: true, timeout: 20_000, maximumAge: 60_000 },
    );
  };
  return (
    <div className="space-y-3">
      <TextField id="field-name" label="Field" autoComplete="off" list="field-name-earlier" value={fieldName} onChange={(e) => onFieldName(e.target.value)} error={error} />
      <datalist id="field-name-earlier">
        {earlier.map((name) => (
          <option key={name} value={name} />
        ))}
      </datalist>
      <div className="flex flex-wrap items-center gap-3">
        <button type="button" onClick={locate} className="min-h-12 rounded-lg border-2 border-ink px-4 font-bold">
          {position ? "Update position" : "Add my position"}
        </button>
        {position ? (
          <>
            <span className="figures">
              {position.lat.toFixed(5)}, {position.lon.toFixed(5)}
            </span>
            <button type="button" onClick={() => onPosition(null)} className="min-h-12 px-2 underline">
              Remove
            </button>
          </>
        ) : null}
      </div>
      {status ? (
        <p className="text-sm" role="status">
          {status}
        </p>
      ) : null}
    </div>
  );
}
