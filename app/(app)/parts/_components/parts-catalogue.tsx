"use client";
// The company's parts catalogue: one row per part number, the components it fits, and for the
// office and the chief engineer the form that adds and changes parts.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMemo, useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { type DataColumn, DataTable, TableSkeleton } from "@/app/_components/data-table";
import { fetchJson } from "@/app/_components/fetch-json";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { RecordTrail } from "@/app/_components/record-trail";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import { LoadProblem, Notice } from "@/app/_components/notice";
import { queryKeys } from "@/app/_components/query-keys";
import { SearchField } from "@/app/_components/search-field";
import { PART_UNITS } from "@/db/schema/parts";
import { type Catalogue, type CataloguePart, PartInput, UNIT_LABEL } from "@/server/parts/contract";
import { type Fit, FitsChooser } from "./fits-chooser";

export function PartsCatalogue({ vessels }: { vessels: Vessels }) {
  const { data, error, isPending } = useQuery({ queryKey: queryKeys.parts(), queryFn: () => fetchJson<Catalogue>("/api/parts") });
  const [editing, setEditing] = useState<CataloguePart | "new" | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [filter, setFilter] = useState("");
  const parts = useMemo(() => {
    const needle = filter.trim().toLowerCase();
    return (data?.parts ?? []).filter((p) => !needle || `${p.number} ${p.description} ${p.makerRef}`.toLowerCase().includes(needle));
  }, [data, filter]);
  if (isPending) return <TableSkeleton label="Loading the parts catalogue" rows={6} />;
  if (error) return <LoadProblem what="parts catalogue" error={error} />;

  const columns: DataColumn<CataloguePart>[] = [
    { id: "number", header: "Part number", cellClassName: "font-mono whitespace-nowrap", cell: (p) => p.number },
    {
      id: "description",
      header: "Description",
      cell: (p) => (
        <div>
          {p.description}
          {p.critical && <span className="ml-2 rounded border border-brass-400 px-1 text-xs font-semibold text-brass-700 dark:text-brass-300">critical spare</span>}
          {p.makerRef && <span className="block text-xs text-ink-500 dark:text-ink-400">maker’s ref. {p.makerRef}</span>}
        </div>
      ),
    },
    { id: "unit", header: "Unit", cell: (p) => UNIT_LABEL[p.unit] },
    { id: "minimum", header: "Minimum on board", align: "right", cellClassName: "tabular-nums", cell: (p) => (p.minimumOnBoard > 0 ? p.minimumOnBoard : "—") },
    {
      id: "fits",
      header: "Fits",
      className: "hidden lg:table-cell",
      cell: (p) => (p.fits.length ? p.fits.map((c) => `${c.vesselCode} ${c.code}`).join(", ") : <span className="text-ink-500">—</span>),
    },
    ...(data.canEdit
      ? [
          {
            id: "edit",
            header: "Actions",
            hideHeader: true,
            cell: (p: CataloguePart) => (
              <button type="button" className="rounded px-1.5 py-0.5 text-xs font-semibold text-tide-700 hover:bg-tide-50 dark:text-tide-300" aria-label={`Edit ${p.number}`} onClick={() => setEditing(p)}>
                Edit
              </button>
            ),
          },
        ]
      : []),
  ];

  return (
    <div className="grid gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-bold">Parts catalogue</h1>
          <p className="max-w-prose text-ink-600 dark:text-ink-300">
            The company’s spare parts by its own part numbers, with the maker’s reference, the unit they are counted in and
            the least to keep on board of each critical spare (the maker’s or class’s recommendation). Each vessel’s Stores
            page shows what it holds.
          </p>
        </div>
        {data.canEdit && (
          <button type="button" className="btn-primary" onClick={() => setEditing("new")}>
            Add part
          </button>
        )}
      </div>
      <Notice message={notice} />
      <section aria-labelledby="parts-heading" className="panel">
        <div className="flex flex-wrap items-center gap-3 border-b border-ink-200 px-4 py-3 dark:border-ink-800">
          <h2 id="parts-heading" className="mr-auto font-semibold">
            Parts <span className="font-normal text-ink-500">({parts.length})</span>
          </h2>
          <SearchField label="Find a part by number, description or maker’s reference" placeholder="Find a part…" value={filter} onChange={setFilter} />
        </div>
        <DataTable
          columns={columns}
          rows={parts}
          rowKey={(p) => p.id}
          labelledBy="parts-heading"
          alignTop
          empty={data.parts.length ? "No part matches." : data.canEdit ? "The catalogue is empty: add the first part." : "The catalogue is empty; the office adds parts."}
        />
      </section>
      {editing && (
        <SidePanel title={editing === "new" ? "Add a part" : `Edit ${editing.number}`} onClose={() => setEditing(null)} wide>
          <PartForm
            vessels={vessels}
            part={editing === "new" ? null : editing}
            onDone={(m) => {
              setEditing(null);
              setNotice(m);
            }}
            onCancel={() => setEditing(null)}
          />
          {editing !== "new" && (
            <div className="mt-4">
              <RecordTrail vesselId={null} table="part" record={editing.id} />
            </div>
          )}
        </SidePanel>
      )}
    </div>
  );
}

type Values = z.input<typeof PartInput>;
type Output = z.output<typeof PartInput>;

type Vessels = { id: string; name: string; code: string }[];

function PartForm({ part, vessels, onDone, onCancel }: { part: CataloguePart | null; vessels: Vessels; onDone: (m: string) => void; onCancel: () => void }) {
  const client = useQueryClient();
  const save = useMutation({
    mutationFn: (values: Output) =>
      fetchJson<CataloguePart>(part ? `/api/parts/${part.id}` : "/api/parts", {
        method: part ? "PATCH" : "POST",
        body: JSON.stringify(values),
      }),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.parts() }),
  });
  const form = useForm<Values, unknown, Output>({
    resolver: zodResolver(PartInput),
    defaultValues: {
      number: part?.number ?? "",
      makerRef: part?.makerRef ?? "",
      description: part?.description ?? "",
      unit: part?.unit ?? "piece",
      critical: part?.critical ?? false,
      minimumOnBoard: part ? String(part.minimumOnBoard) : "0",
      fits: part?.fits.map((f) => f.id) ?? [],
    },
  });
  const { register, formState } = form;
  const { errors, isSubmitting } = formState;
  // The chosen components with their vessel and code, for the chips; the form holds their ids.
  const [fits, setFits] = useState<Fit[]>(part?.fits ?? []);
  const chooseFits = (next: Fit[]) => {
    setFits(next);
    form.setValue("fits", next.map((f) => f.id), { shouldDirty: true });
  };
  const { onSubmit, problem } = useSendForm(form, {
    fields: ["number", "makerRef", "description", "unit", "critical", "minimumOnBoard", "fits"],
    send: async (values) => {
      const saved = await save.mutateAsync(values);
      onDone(`${saved.number} ${part ? "saved" : "added to the catalogue"}.`);
    },
  });
  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <Field id="part-number" label="Part number" hint="The company’s own, e.g. KP-10432." error={errors.number?.message}>
        <input className="field font-mono" autoComplete="off" {...describedBy("part-number", errors.number?.message, true)} {...register("number")} />
      </Field>
      <Field id="part-description" label="Description" error={errors.description?.message}>
        <input className="field" autoComplete="off" {...describedBy("part-description", errors.description?.message)} {...register("description")} />
      </Field>
      <Field id="part-maker" label="Maker’s reference" hint="Optional, as on the maker’s parts list." error={errors.makerRef?.message}>
        <input className="field" autoComplete="off" {...describedBy("part-maker", errors.makerRef?.message, true)} {...register("makerRef")} />
      </Field>
      <Field id="part-unit" label="Counted in" error={errors.unit?.message}>
        <select className="field w-40" {...describedBy("part-unit", errors.unit?.message)} {...register("unit")}>
          {PART_UNITS.map((u) => (
            <option key={u} value={u}>
              {u === "piece" ? "pieces" : u === "set" ? "sets" : u === "litre" ? "litres" : u === "metre" ? "metres" : u}
            </option>
          ))}
        </select>
      </Field>
      <label className="flex items-center gap-2">
        <input type="checkbox" className="accent-brass-600" {...register("critical")} />
        Critical spare: keep some on board (the maker’s or class’s recommendation)
      </label>
      <Field id="part-minimum" label="Minimum on board" hint="On each vessel that stocks it; 0 for none." error={errors.minimumOnBoard?.message}>
        <input className="field w-32 text-right tabular-nums" inputMode="decimal" autoComplete="off" {...describedBy("part-minimum", errors.minimumOnBoard?.message, true)} {...register("minimumOnBoard")} />
      </Field>
      <FitsChooser vessels={vessels} chosen={fits} onChange={chooseFits} error={errors.fits?.message ?? errors.fits?.root?.message} />
      <FormActions submitLabel={part ? "Save part" : "Add part"} busy={isSubmitting} problem={problem} onCancel={onCancel} />
    </form>
  );
}
