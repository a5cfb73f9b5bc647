"use client";

import { useId, useRef, useState } from "react";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { ProblemError } from "@/app/_components/fetch-json";
import { Notice } from "@/app/_components/notice";
import {
  ACCEPT,
  type AttachmentView,
  formatBytes,
  isImage,
  MAX_ATTACHMENT_BYTES,
  MAX_CAPTION_LENGTH,
} from "@/server/attachments/contract";
import { formatShipTime } from "@/server/format/hours";
import { useAttachments, useRemoveAttachment, useUploadAttachment } from "./use-attachments";

type Props = { vesselId: string; workOrderId: string; timeZone: string };

type Pending = { key: string; name: string; share: number };
type Refusal = { key: string; message: string };

/**
 * Photos and documents kept with the completion: the condition found, the job done, a gauge or
 * display read, a maker's service report. Added and removed while the completion is not yet
 * approved; the same list, read-only, for the chief deciding and for the office.
 */
export function AttachmentsSection({ vesselId, workOrderId, timeZone }: Props) {
  const query = useAttachments(vesselId, workOrderId);
  const upload = useUploadAttachment(vesselId, workOrderId);
  const remove = useRemoveAttachment(vesselId, workOrderId);
  const [caption, setCaption] = useState("");
  const [pending, setPending] = useState<Pending[]>([]);
  const [refusals, setRefusals] = useState<Refusal[]>([]);
  const [message, setMessage] = useState<string | null>(null);
  const headingRef = useRef<HTMLHeadingElement>(null);
  const ids = useId();
  const captionId = `${ids}-caption`;
  const errorId = `${ids}-file-error`;
  const hintId = `${ids}-file-hint`;

  const data = query.data;
  const captionError =
    caption.trim().length > MAX_CAPTION_LENGTH ? `Keep the caption under ${MAX_CAPTION_LENGTH} characters.` : null;

  /** One file after another: the count check stays simple and a slow link is not split twelve ways. */
  async function addFiles(list: FileList | null, input: HTMLInputElement) {
    const files = [...(list ?? [])];
    input.value = "";
    if (!files.length) return;
    setMessage(null);
    setRefusals([]);
    if (captionError) {
      setRefusals([{ key: "caption", message: "Shorten the caption first; nothing was sent." }]);
      return;
    }
    const queued = files.map((file, i) => ({ file, key: `${Date.now()}-${i}-${file.name}` }));
    setPending((p) => [...p, ...queued.map(({ file, key }) => ({ key, name: file.name, share: 0 }))]);
    let added = 0;
    for (const { file, key } of queued) {
      try {
        if (file.size > MAX_ATTACHMENT_BYTES) {
          throw new Error(
            `“${file.name}” is ${formatBytes(file.size)}, larger than the ${formatBytes(MAX_ATTACHMENT_BYTES)} one file may be.`,
          );
        }
        await upload.mutateAsync({
          file,
          caption,
          onProgress: (share) => setPending((p) => p.map((x) => (x.key === key ? { ...x, share } : x))),
        });
        added += 1;
      } catch (error) {
        const text =
          error instanceof ProblemError
            ? (error.problem.errors?.[0]?.message ?? error.problem.detail)
            : error instanceof Error && error.message !== "network"
              ? error.message
              : `“${file.name}” could not be sent. Check the connection and try again.`;
        setRefusals((r) => [...r, { key, message: text }]);
      } finally {
        setPending((p) => p.filter((x) => x.key !== key));
      }
    }
    if (added) {
      setCaption("");
      setMessage(`${added === 1 ? "1 file" : `${added} files`} added.`);
    }
  }

  async function removeOne(attachment: AttachmentView) {
    setMessage(null);
    setRefusals([]);
    try {
      await remove.mutateAsync(attachment.id);
      setMessage(`“${attachment.fileName}” removed.`);
      headingRef.current?.focus();
    } catch (error) {
      setRefusals([{ key: attachment.id, message: problemSentence(error, "nothing was removed") }]);
    }
  }

  const items = data?.attachments ?? [];
  const busy = pending.length > 0;
  return (
    <section aria-labelledby={`${ids}-heading`} className="grid gap-3 panel p-4" data-testid="attachments">
      <div>
        <h2 id={`${ids}-heading`} ref={headingRef} tabIndex={-1} className="text-base font-semibold">
          Photos and documents
        </h2>
        <p className="mt-0.5 text-sm text-ink-600 dark:text-ink-300">
          The condition found, the job done, a gauge or display read, a maker’s service report: the chief engineer,
          the office and class surveyors see them with the completion.
        </p>
      </div>

      {query.error ? (
        <p role="alert" className="text-alarm-700 dark:text-alarm-300">
          The photos and documents could not be loaded: {query.error.message}
        </p>
      ) : !data ? (
        <div className="h-24 animate-pulse rounded-md bg-ink-100 dark:bg-ink-800" aria-busy="true" />
      ) : items.length === 0 && !busy ? (
        <p className="text-ink-500 dark:text-ink-400">
          No photos or documents yet.
          {data.may.add && " Add a photo of what you found and one of the job done."}
        </p>
      ) : (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4" aria-label="Attached files">
          {items.map((a) => (
            <AttachmentCard
              key={a.id}
              attachment={a}
              timeZone={timeZone}
              removing={remove.isPending && remove.variables === a.id}
              onRemove={() => removeOne(a)}
            />
          ))}
          {pending.map((p) => (
            <li
              key={p.key}
              className="grid content-center gap-2 rounded-md border border-dashed border-ink-300 p-3 text-sm dark:border-ink-700"
              aria-busy="true"
            >
              <span className="truncate font-medium" title={p.name}>
                {p.name}
              </span>
              <progress
                className="h-2 w-full accent-tide-600 dark:accent-tide-400"
                max={1}
                value={p.share}
                aria-label={`Sending ${p.name}`}
              />
              <span className="text-xs text-ink-500 dark:text-ink-400">
                {p.share < 1 ? `Sending… ${Math.round(p.share * 100)} %` : "Checking and storing…"}
              </span>
            </li>
          ))}
        </ul>
      )}

      <Notice message={message} className="no-print" />

      {data?.lockedReason && <p className="text-sm text-ink-600 dark:text-ink-300">{data.lockedReason}</p>}

      {data && (data.may.add || refusals.length > 0) && (
        <div className="no-print grid gap-3 border-t border-ink-200 pt-3 dark:border-ink-800">
          {data.may.add && (
            <>
              <div className="max-w-xl">
                <label htmlFor={captionId} className="label">
                  Caption for the next files (optional)
                </label>
                <input
                  id={captionId}
                  className="field"
                  value={caption}
                  maxLength={MAX_CAPTION_LENGTH + 20}
                  placeholder="e.g. Liner 3 as found, scoring at the top ring"
                  onChange={(e) => setCaption(e.target.value)}
                  aria-invalid={captionError ? true : undefined}
                  aria-describedby={captionError ? `${captionId}-error` : undefined}
                />
                {captionError && (
                  <p id={`${captionId}-error`} className="field-error">
                    {captionError}
                  </p>
                )}
              </div>
              <div className="flex flex-wrap items-center gap-2">
                {/* A label styled as a button opens each input; the inputs stay real and focusable. */}
                <FilePicker
                  label="Take a photo"
                  accept="image/*"
                  capture
                  disabled={busy}
                  describedBy={`${hintId}${refusals.length ? ` ${errorId}` : ""}`}
                  onFiles={addFiles}
                />
                <FilePicker
                  label="Add photos or documents"
                  accept={ACCEPT}
                  multiple
                  disabled={busy}
                  describedBy={`${hintId}${refusals.length ? ` ${errorId}` : ""}`}
                  onFiles={addFiles}
                />
              </div>
              <p id={hintId} className="text-xs text-ink-500 dark:text-ink-400">
                JPEG, PNG or WebP photos and PDF documents, up to {formatBytes(data.limits.maxBytes)} each and{" "}
                {data.limits.maxFiles} per work order ({items.length} attached).
              </p>
            </>
          )}
          {refusals.length > 0 && (
            <ul id={errorId} role="alert" className="grid gap-1">
              {refusals.map((r) => (
                <li key={r.key} className="field-error mt-0 text-sm">
                  {r.message}
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </section>
  );
}

type PickerProps = {
  label: string;
  accept: string;
  multiple?: boolean;
  capture?: boolean;
  disabled: boolean;
  describedBy: string;
  onFiles: (files: FileList | null, input: HTMLInputElement) => void;
};

/** A native file input (keyboard and screen readers know it) behind a button-like label. */
function FilePicker({ label, accept, multiple, capture, disabled, describedBy, onFiles }: PickerProps) {
  const id = useId();
  return (
    <span className="relative">
      <input
        id={id}
        type="file"
        className="peer sr-only"
        accept={accept}
        multiple={multiple}
        // Tablets open the rear camera at once; desktops ignore it and offer a file.
        capture={capture ? "environment" : undefined}
        disabled={disabled}
        aria-describedby={describedBy}
        onChange={(e) => onFiles(e.target.files, e.target)}
      />
      <label
        htmlFor={id}
        className={`btn-quiet cursor-pointer peer-focus-visible:outline-2 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-tide-500 ${disabled ? "pointer-events-none opacity-50" : ""}`}
      >
        {label}
      </label>
    </span>
  );
}

type CardProps = { attachment: AttachmentView; timeZone: string; removing: boolean; onRemove: () => void };

function AttachmentCard({ attachment: a, timeZone, removing, onRemove }: CardProps) {
  const [confirming, setConfirming] = useState(false);
  const keepRef = useRef<HTMLButtonElement>(null);
  const image = isImage(a.contentType);
  return (
    <li className="grid content-start overflow-hidden rounded-md border border-ink-200 dark:border-ink-800">
      <a
        href={a.url}
        target={image ? "_blank" : undefined}
        rel={image ? "noopener" : undefined}
        className="block bg-ink-100 dark:bg-ink-850"
        aria-label={image ? `Open ${a.fileName} full size` : `Download ${a.fileName}`}
      >
        {image ? (
          // Served by the app's download route (the session's cookie): next/image would fetch it itself.
          // eslint-disable-next-line @next/next/no-img-element
          <img src={a.url} alt={a.caption ?? a.fileName} loading="lazy" className="aspect-[4/3] w-full object-cover" />
        ) : (
          <span className="flex aspect-[4/3] w-full flex-col items-center justify-center gap-1 text-alarm-700 dark:text-alarm-300">
            <PdfIcon />
            <span className="text-xs font-semibold text-ink-600 dark:text-ink-300">PDF · {formatBytes(a.byteSize)}</span>
          </span>
        )}
      </a>
      <div className="grid gap-0.5 p-2 text-sm">
        {a.caption && <p className="font-medium">{a.caption}</p>}
        <p className="truncate text-xs text-ink-600 dark:text-ink-300" title={a.fileName}>
          {a.fileName}
        </p>
        <p className="text-xs text-ink-500 dark:text-ink-400">
          {a.uploadedBy ?? "—"}, {formatShipTime(new Date(a.uploadedAt), timeZone)}
        </p>
        {a.mayRemove &&
          (confirming ? (
            <div className="no-print mt-1 grid gap-1" role="group" aria-label={`Remove ${a.fileName}?`}>
              <p className="text-xs font-semibold">Remove this file? It cannot be brought back.</p>
              <div className="flex gap-1">
                <button
                  type="button"
                  className="btn bg-alarm-600 px-2 py-1 text-xs text-white hover:bg-alarm-700 dark:bg-alarm-500 dark:text-white dark:hover:bg-alarm-600"
                  disabled={removing}
                  onClick={onRemove}
                >
                  {removing ? "Removing…" : "Remove"}
                </button>
                <button
                  ref={keepRef}
                  type="button"
                  className="btn-quiet px-2 py-1 text-xs"
                  disabled={removing}
                  onClick={() => setConfirming(false)}
                >
                  Keep
                </button>
              </div>
            </div>
          ) : (
            <button
              type="button"
              // A button-sized target: a gloved finger on a tablet, not a mouse pointer.
              className="no-print btn-quiet mt-1 justify-self-start px-2 py-1 text-xs text-alarm-700 dark:text-alarm-300"
              onClick={() => {
                setConfirming(true);
                // The safe answer takes focus: Enter by habit keeps the file.
                requestAnimationFrame(() => keepRef.current?.focus());
              }}
              aria-label={`Remove ${a.fileName}`}
            >
              Remove…
            </button>
          ))}
      </div>
    </li>
  );
}

function PdfIcon() {
  return (
    <svg viewBox="0 0 24 24" className="size-10" fill="none" stroke="currentColor" strokeWidth="1.5" aria-hidden="true">
      <path d="M14 3H7a2 2 0 0 0-2 2v14a2 2 0 0 0 2 2h10a2 2 0 0 0 2-2V8z" />
      <path d="M14 3v5h5" />
      <text x="12" y="17" textAnchor="middle" fontSize="5.5" fontWeight="700" fill="currentColor" stroke="none">
        PDF
      </text>
    </svg>
  );
}
