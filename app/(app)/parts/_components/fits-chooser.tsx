"use client";
// The components a part fits, chosen from any vessel's register the person sees: a vessel, a search
// over its components, a tick per component; what is chosen stays listed (with its vessel) to remove.
import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type { RegisterView } from "@/server/register/contract";

export type Fit = { id: string; code: string; name: string; vesselCode: string };
type Props = { vessels: { id: string; name: string; code: string }[]; chosen: Fit[]; onChange: (next: Fit[]) => void; error?: string };

/** More matches than this: the list asks for a narrower search. */
const SHOWN = 60;

export function FitsChooser({ vessels, chosen, onChange, error }: Props) {
  const [vesselId, setVesselId] = useState(vessels[0]?.id ?? "");
  const [search, setSearch] = useState("");
  const vessel = vessels.find((v) => v.id === vesselId);
  const register = useQuery({
    queryKey: queryKeys.register(vesselId),
    queryFn: () => fetchJson<RegisterView>(`/api/vessels/${vesselId}/register`),
    enabled: Boolean(vesselId),
  });
  const needle = search.trim().toLowerCase();
  const matches = (register.data?.components ?? []).filter((c) => !needle || `${c.code} ${c.name}`.toLowerCase().includes(needle));
  const has = new Set(chosen.map((c) => c.id));
  const toggle = (c: { id: string; code: string; name: string }) =>
    onChange(has.has(c.id) ? chosen.filter((x) => x.id !== c.id) : [...chosen, { id: c.id, code: c.code, name: c.name, vesselCode: vessel?.code ?? "" }]);

  return (
    <fieldset className="grid gap-2" aria-describedby={error ? "fits-error" : undefined}>
      <legend className="label">Fits</legend>
      {chosen.length ? (
        <ul className="flex flex-wrap gap-1.5" aria-label="Components it fits">
          {chosen.map((c) => (
            <li key={c.id} className="flex items-center gap-1 rounded border border-ink-200 px-1.5 py-0.5 text-sm dark:border-ink-700">
              <span className="font-mono">
                {c.vesselCode} {c.code}
              </span>
              <button type="button" className="rounded px-1 text-ink-500 hover:bg-ink-100 dark:hover:bg-ink-800" onClick={() => onChange(chosen.filter((x) => x.id !== c.id))}>
                ×<span className="sr-only"> Remove {c.vesselCode} {c.code}</span>
              </button>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-ink-500">No component chosen: the part fits anything it is listed for on a routine.</p>
      )}
      <div className="flex flex-wrap gap-2">
        <select aria-label="Vessel of the components" className="field w-auto" value={vesselId} onChange={(e) => setVesselId(e.target.value)}>
          {vessels.map((v) => (
            <option key={v.id} value={v.id}>
              {v.name}
            </option>
          ))}
        </select>
        <input aria-label="Find a component by code or name" placeholder="Find a component…" className="field min-w-0 flex-1" value={search} onChange={(e) => setSearch(e.target.value)} />
      </div>
      {register.error ? (
        <p className="field-error">The register of {vessel?.name} could not be loaded.</p>
      ) : !register.data ? (
        <p aria-busy="true" className="text-sm text-ink-500">
          Loading the register…
        </p>
      ) : (
        <ul className="max-h-56 overflow-y-auto rounded border border-ink-200 p-1 dark:border-ink-800" aria-label={`Components of ${vessel?.name ?? "the vessel"}`}>
          {matches.slice(0, SHOWN).map((c) => (
            <li key={c.id}>
              <label className="flex items-center gap-2 rounded px-1 py-0.5 hover:bg-ink-50 dark:hover:bg-ink-800">
                <input type="checkbox" className="accent-tide-600" checked={has.has(c.id)} onChange={() => toggle(c)} />
                <span className="font-mono text-sm">{c.code}</span> <span className="text-sm">{c.name}</span>
              </label>
            </li>
          ))}
          {matches.length > SHOWN && <li className="px-1 text-sm text-ink-500">{matches.length - SHOWN} more: narrow the search.</li>}
          {matches.length === 0 && <li className="px-1 text-sm text-ink-500">No component matches.</li>}
        </ul>
      )}
      {error && (
        <p id="fits-error" className="field-error">
          {error}
        </p>
      )}
    </fieldset>
  );
}
