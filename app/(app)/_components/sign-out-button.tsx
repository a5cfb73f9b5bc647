"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";

export function SignOutButton() {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      className="btn-quiet"
      disabled={busy}
      onClick={async () => {
        setBusy(true);
        // better-auth's client (13 kB compressed) is needed only here: loaded on the press, not
        // with every page of the signed-in shell.
        const { authClient } = await import("@/app/_components/auth-client");
        await authClient.signOut();
        router.replace("/sign-in");
        router.refresh();
      }}
    >
      Sign out
    </button>
  );
}
