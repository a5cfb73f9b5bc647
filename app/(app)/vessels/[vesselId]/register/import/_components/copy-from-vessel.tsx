"use client";
// Copy the plan of a sister ship: choose the vessel, see what the copy would do (the import's
// preview), then copy. The copied routines count from today at 0 h on this vessel's new meters.
import { useState } from "react";
import { fetchJson } from "@/app/_components/fetch-json";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { Notice } from "@/app/_components/notice";
import type { ImportPreview, ImportResult } from "@/server/import/service";
import { PreviewView } from "./import-preview";

type Props = { vesselId: string; vessels: { id: string; name: string }[]; onCopied: () => void };

export function CopyFromVessel({ vesselId, vessels, onCopied }: Props) {
  const [from, setFrom] = useState("");
  const [onlyMissing, setOnlyMissing] = useState(false);
  const [busy, setBusy] = useState(false);
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const send = <T,>(apply: boolean) =>
    fetchJson<T>(`/api/vessels/${vesselId}/import/copy`, { method: "POST", body: JSON.stringify({ fromVesselId: from, apply, onlyMissing }) });

  async function check() {
    setProblem(null);
    setDone(null);
    setBusy(true);
    try {
      setPreview(await send<ImportPreview>(false));
    } catch (error) {
      setPreview(null);
      setProblem(problemSentence(error, "nothing was checked"));
    } finally {
      setBusy(false);
    }
  }

  async function copy() {
    setProblem(null);
    setBusy(true);
    try {
      const r = await send<ImportResult>(true);
      setDone(`Copied: ${r.counts.components.created} components, ${r.counts.counters.created} counters and ${r.counts.routines.created} routines created. The Backlog shows the new work within a minute.`);
      setPreview(null);
      onCopied();
    } catch (error) {
      setProblem(problemSentence(error, "nothing was copied"));
    } finally {
      setBusy(false);
    }
  }

  if (!vessels.length) return null;
  return (
    <section aria-labelledby="copy-heading" className="panel grid gap-3 p-4">
      <h2 id="copy-heading" className="font-semibold">
        Copy the plan of a sister ship
      </h2>
      <p className="max-w-prose text-sm text-ink-700 dark:text-ink-200">
        Its machinery register, its counters (new here, with empty meters) and its routines with their settings. The
        copied routines count from today at 0 h; the sister ship’s history stays hers. What this vessel has already takes
        the sister ship’s settings, unless you ask to add only what it lacks.
      </p>
      <div className="flex flex-wrap items-end gap-2">
        <div>
          <label htmlFor="copy-from" className="label">
            Copy from
          </label>
          <select id="copy-from" className="field" value={from} disabled={busy} onChange={(e) => { setFrom(e.target.value); setPreview(null); }}>
            <option value="">Choose a vessel…</option>
            {vessels.map((v) => (
              <option key={v.id} value={v.id}>
                {v.name}
              </option>
            ))}
          </select>
        </div>
        <label className="flex items-center gap-2 pb-2 text-sm">
          <input
            type="checkbox"
            className="accent-tide-600"
            checked={onlyMissing}
            disabled={busy}
            onChange={(e) => {
              setOnlyMissing(e.target.checked);
              setPreview(null);
            }}
          />
          Only add what this vessel lacks
        </label>
        <button type="button" className="btn-quiet" disabled={busy || !from} onClick={check}>
          {busy && !preview ? "Checking…" : "Check the copy"}
        </button>
      </div>
      <Notice tone="problem" message={problem} />
      <Notice message={done} />
      {preview && <PreviewView preview={preview} onApply={copy} busy={busy} what="copy" />}
    </section>
  );
}
