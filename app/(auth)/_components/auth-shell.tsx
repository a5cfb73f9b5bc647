import type { ReactNode } from "react";
import { KeelsonMark } from "@/app/_components/keelson-mark";

/** The narrow card every signed-out page sits in. */
export function AuthShell({ children }: { children: ReactNode }) {
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center px-4 py-10">
      <div className="mb-6 flex items-center gap-2">
        <KeelsonMark className="h-9 w-9" />
        <div>
          <p className="text-xl font-bold tracking-tight">Keelson</p>
          <p className="text-ink-500 dark:text-ink-400">Planned maintenance for the engine department</p>
        </div>
      </div>
      <div className="panel p-6">{children}</div>
    </main>
  );
}
