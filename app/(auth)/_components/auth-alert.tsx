import type { ReactNode } from "react";

/** What went wrong on a signed-out form, read out at once. */
export function AuthAlert({ children }: { children: ReactNode }) {
  return (
    <p
      role="alert"
      className="rounded-md bg-alarm-50 px-3 py-2 text-alarm-700 dark:bg-alarm-700/20 dark:text-alarm-300"
    >
      {children}
    </p>
  );
}
