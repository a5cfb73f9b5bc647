"use client";
// Choose the files, have them checked (the preview), read what would happen and every problem by
// file, row and column, then apply — with a progress bar while the files go up and while the
// server reads or applies them.
import Link from "next/link";
import { useState } from "react";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { Notice } from "@/app/_components/notice";
import { uploadWithProgress } from "@/app/_components/upload-with-progress";
import type { ImportPreview, ImportResult } from "@/server/import/service";
import { CopyFromVessel } from "./copy-from-vessel";
import { ImportHistory } from "./import-history";
import { PreviewView } from "./import-preview";

type Step = { kind: "idle" } | { kind: "sending"; what: "check" | "apply"; share: number } | { kind: "previewed"; preview: ImportPreview };

export function ImportView({ vesselId, sisters }: { vesselId: string; sisters: { id: string; name: string }[] }) {
  const [files, setFiles] = useState<File[]>([]);
  const [retire, setRetire] = useState(false);
  const [step, setStep] = useState<Step>({ kind: "idle" });
  const [problem, setProblem] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [historyKey, setHistoryKey] = useState(0);

  const form = () => {
    const data = new FormData();
    for (const f of files) data.append("file", f, f.name);
    if (retire) data.append("retire", "on");
    return data;
  };
  const send = <T,>(what: "check" | "apply") =>
    uploadWithProgress<T>(`/api/vessels/${vesselId}/import${what === "check" ? "/preview" : ""}`, form(), (share) =>
      setStep({ kind: "sending", what, share }),
    );

  async function check() {
    setProblem(null);
    setDone(null);
    if (!files.length) {
      setProblem("Choose the plan’s files first: CSV files, a zip of them, or an Excel workbook.");
      return;
    }
    setStep({ kind: "sending", what: "check", share: 0 });
    try {
      setStep({ kind: "previewed", preview: await send<ImportPreview>("check") });
    } catch (error) {
      setStep({ kind: "idle" });
      setProblem(problemSentence(error, "nothing was checked"));
    }
  }

  async function apply() {
    setProblem(null);
    setStep({ kind: "sending", what: "apply", share: 0 });
    try {
      const result = await send<ImportResult>("apply");
      const c = result.counts;
      const changed = c.components.changed + c.counters.changed + c.routines.changed;
      setDone(
        `Imported: ${many(c.components.created, "component")}, ${many(c.counters.created, "counter")} and ` +
          `${many(c.routines.created, "routine")} created; ${changed} changed; ${many(c.routines.retired + c.counters.retired, c.counters.retired ? "routine or counter" : "routine")} retired` +
          `${c.readings?.created ? `; ${many(c.readings.created, "reading")} added` : ""}. ` +
          "The Backlog shows the new work within a minute.",
      );
      setStep({ kind: "idle" });
      setFiles([]);
      setHistoryKey((k) => k + 1);
    } catch (error) {
      setStep({ kind: "idle" });
      setProblem(problemSentence(error, "nothing was imported"));
    }
  }

  const busy = step.kind === "sending";
  return (
    <div className="grid gap-4">
      <section aria-labelledby="import-files-heading" className="panel grid gap-3 p-4">
        <h2 id="import-files-heading" className="font-semibold">
          Files
        </h2>
        <div>
          <label htmlFor="import-files" className="label">
            The plan’s files (.csv, .zip or .xlsx, up to 10 files, 20 MB together)
          </label>
          <input
            id="import-files"
            type="file"
            multiple
            accept=".csv,.xlsx,.zip,text/csv,application/zip,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
            className="field"
            disabled={busy}
            onChange={(e) => {
              setFiles([...(e.target.files ?? [])]);
              setStep({ kind: "idle" });
              setDone(null);
            }}
          />
        </div>
        <label className="flex items-start gap-2">
          <input type="checkbox" className="mt-1 accent-tide-600" checked={retire} disabled={busy} onChange={(e) => setRetire(e.target.checked)} />
          <span>
            Retire what the files no longer list
            <span className="block text-sm text-ink-500 dark:text-ink-400">
              Off: an import only adds and changes. On: the routines of this vessel missing from the routines file are
              retired, and their open work orders with nothing recorded on them go; so are the counters missing from the
              counters file (their readings stay). Components are removed in the register, where their history shows.
            </span>
          </span>
        </label>
        {busy && (
          <div className="grid gap-1 text-sm" aria-live="polite">
            <span>
              {step.share < 1
                ? `Sending the files… ${Math.round(step.share * 100)} %`
                : step.what === "check"
                  ? "Reading and checking every row…"
                  : "Applying the import…"}
            </span>
            <progress className="w-full" max={1} value={step.share < 1 ? step.share : undefined} aria-label="Import progress" />
          </div>
        )}
        <div className="flex flex-wrap gap-2">
          <button type="button" className="btn-primary" disabled={busy} onClick={check}>
            Check the files
          </button>
        </div>
        <Notice tone="problem" message={problem} />
        <Notice message={done} />
        {done && (
          <p className="text-sm">
            <Link href={`/vessels/${vesselId}/backlog`} className="text-tide-700 underline underline-offset-2 dark:text-tide-300">
              Open the Backlog
            </Link>
          </p>
        )}
      </section>
      {step.kind === "previewed" && <PreviewView preview={step.preview} onApply={apply} busy={busy} />}
      <CopyFromVessel vesselId={vesselId} vessels={sisters} onCopied={() => setHistoryKey((k) => k + 1)} />
      <ImportHistory vesselId={vesselId} refresh={historyKey} />
    </div>
  );
}

const many = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;
