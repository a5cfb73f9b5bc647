"use client";

import Link from "next/link";
import { useState } from "react";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { LoadProblem, Notice } from "@/app/_components/notice";
import type { RegisterView } from "@/server/register/contract";
import { RecordTrail } from "@/app/_components/record-trail";
import { ComponentForm } from "./component-form";
import { type ComponentAction, ComponentTree } from "./component-tree";
import { CounterForm } from "./counter-form";
import { type CounterAction, CountersPanel } from "./counters-panel";
import { MeterReplacementForm } from "./meter-replacement-form";
import { MoveForm } from "./move-form";
import { RetireCounter } from "./retire-counter";
import { useRegister } from "./use-register";

/** Which form is open beside the register, and on what. */
type Sheet =
  | { kind: "add-component"; parentId: string | null }
  | { kind: "edit-component" | "move-component"; componentId: string }
  | { kind: "add-counter" }
  | { kind: CounterAction; counterId: string };

export function MachineryRegister({ vesselId }: { vesselId: string }) {
  const { data, error, isPending } = useRegister(vesselId);
  const [sheet, setSheet] = useState<Sheet | null>(null);
  const [done, setDone] = useState<string | null>(null);

  if (isPending) return <RegisterSkeleton />;
  if (error) return <LoadProblem what="machinery register" error={error} />;

  const open = (next: Sheet) => {
    setDone(null);
    setSheet(next);
  };
  const onComponent = (action: ComponentAction, component: { id: string }) =>
    open(
      action === "add-child"
        ? { kind: "add-component", parentId: component.id }
        : { kind: action, componentId: component.id },
    );
  const close = () => setSheet(null);
  const finish = (message: string) => {
    setSheet(null);
    setDone(message);
  };

  return (
    <div className="grid gap-4">
      <div className="flex flex-wrap items-center gap-3">
        <p className="mr-auto text-ink-600 dark:text-ink-300">
          The vessel’s machinery as a tree of components; a component without a counter of its own runs on the nearest
          counter above it.
        </p>
        {data.canEdit && (
          <Link href={`/vessels/${vesselId}/register/import`} className="btn-quiet">
            Import from files
          </Link>
        )}
        {data.canEdit && data.components.length > 0 && (
          <button type="button" className="btn-primary" onClick={() => open({ kind: "add-component", parentId: null })}>
            Add component
          </button>
        )}
      </div>
      <Notice message={done} />

      <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,1fr)_22rem]">
        {data.components.length === 0 ? (
          <EmptyRegister view={data} onAdd={() => open({ kind: "add-component", parentId: null })} />
        ) : (
          <ComponentTree view={data} onAction={onComponent} />
        )}
        <CountersPanel
          view={data}
          onAdd={() => open({ kind: "add-counter" })}
          onAction={(kind, c) => open({ kind, counterId: c.id })}
        />
      </div>

      {sheet && <SheetFor sheet={sheet} view={data} onDone={finish} onCancel={close} />}
    </div>
  );
}

function SheetFor({
  sheet,
  view,
  onDone,
  onCancel,
}: {
  sheet: Sheet;
  view: RegisterView;
  onDone: (m: string) => void;
  onCancel: () => void;
}) {
  const props = { onDone, onCancel };
  switch (sheet.kind) {
    case "add-component":
      return (
        <SidePanel title={sheet.parentId ? "Add a part" : "Add a component"} onClose={onCancel}>
          <ComponentForm view={view} target={{ parentId: sheet.parentId }} {...props} />
        </SidePanel>
      );
    case "edit-component":
    case "move-component": {
      const component = view.components.find((c) => c.id === sheet.componentId);
      if (!component) return null;
      return sheet.kind === "edit-component" ? (
        <SidePanel title={`Edit ${component.code}`} subtitle={component.name} onClose={onCancel}>
          <ComponentForm view={view} target={{ component }} {...props} />
          <div className="mt-4">
            <RecordTrail vesselId={view.vessel.id} table="component" record={component.id} />
          </div>
        </SidePanel>
      ) : (
        <SidePanel title={`Move ${component.code}`} subtitle={component.name} onClose={onCancel}>
          <MoveForm view={view} component={component} {...props} />
        </SidePanel>
      );
    }
    case "add-counter":
      return (
        <SidePanel title="Add a counter" subtitle="An hour meter on board" onClose={onCancel}>
          <CounterForm vesselId={view.vessel.id} counter={null} {...props} />
        </SidePanel>
      );
    default: {
      const counter = view.counters.find((c) => c.id === sheet.counterId);
      if (!counter) return null;
      if (sheet.kind === "edit-counter") {
        return (
          <SidePanel title="Edit counter" subtitle={counter.name} onClose={onCancel}>
            <CounterForm vesselId={view.vessel.id} counter={counter} {...props} />
          </SidePanel>
        );
      }
      if (sheet.kind === "replace-meter") {
        return (
          <SidePanel title="Replace the hour meter" subtitle={counter.name} onClose={onCancel}>
            <MeterReplacementForm view={view} counter={counter} {...props} />
          </SidePanel>
        );
      }
      return (
        <SidePanel title="Retire counter" subtitle={counter.name} onClose={onCancel}>
          <RetireCounter vesselId={view.vessel.id} counter={counter} {...props} />
        </SidePanel>
      );
    }
  }
}

function EmptyRegister({ view, onAdd }: { view: RegisterView; onAdd: () => void }) {
  return (
    <div className="grid justify-items-start gap-2 panel p-6">
      <p className="font-medium">The register of {view.vessel.name} has no components yet.</p>
      {view.canEdit ? (
        <>
          <p className="text-ink-600 dark:text-ink-300">
            Start with the main machinery (main engine, generating sets, compressors, purifiers), then add their parts
            under them. Add each hour meter on board in the counters panel.
          </p>
          <button type="button" className="btn-primary" onClick={onAdd}>
            Add the first component
          </button>
        </>
      ) : (
        <p className="text-ink-600 dark:text-ink-300">
          A chief engineer or the company administrator builds the register.
        </p>
      )}
    </div>
  );
}

function RegisterSkeleton() {
  return (
    <div
      className="grid animate-pulse gap-4 lg:grid-cols-[minmax(0,1fr)_22rem]"
      aria-busy="true"
      aria-label="Loading the machinery register"
    >
      <div className="panel p-4">
        {Array.from({ length: 12 }, (_, i) => (
          <div
            key={i}
            className="mb-2 h-7 rounded bg-ink-100 dark:bg-ink-850"
            style={{ marginLeft: `${(i % 3) * 1.25}rem` }}
          />
        ))}
      </div>
      <div className="h-96 panel p-4" />
    </div>
  );
}
