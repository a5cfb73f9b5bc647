"use client";

import { useParams, usePathname, useRouter } from "next/navigation";

type Option = { id: string; name: string; code: string };

/** Moves to the same section of another vessel: from one ship's Hour log to the next one's. */
export function VesselSwitcher({ vessels }: { vessels: Option[] }) {
  const router = useRouter();
  const pathname = usePathname();
  const params = useParams<{ vesselId?: string }>();
  if (vessels.length === 0) return null;
  const section = pathname.match(/^\/vessels\/[^/]+\/([^/]+)/)?.[1] ?? "hour-log";

  return (
    <label className="flex items-center gap-2">
      <span className="sr-only">Vessel</span>
      <select
        className="field w-auto py-1 font-medium"
        value={params.vesselId ?? ""}
        onChange={(e) => e.target.value && router.push(`/vessels/${e.target.value}/${section}`)}
      >
        {!params.vesselId && <option value="">Choose a vessel…</option>}
        {vessels.map((v) => (
          <option key={v.id} value={v.id}>
            {v.name} ({v.code})
          </option>
        ))}
      </select>
    </label>
  );
}
