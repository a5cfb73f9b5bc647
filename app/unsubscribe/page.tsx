import type { Metadata } from "next";
import Link from "next/link";
import { KeelsonMark } from "@/app/_components/keelson-mark";
import { getDb } from "@/db/client";
import { MAIL_KIND_EFFECT } from "@/server/mail/kinds";
import { verifyUnsubscribe } from "@/server/mail/links";
import { describeOptOut } from "@/server/mail/opt-out";

export const metadata: Metadata = { title: "Unsubscribe", robots: { index: false } };

type Search = Record<string, string | string[] | undefined>;

const first = (value: string | string[] | undefined) => (Array.isArray(value) ? value[0] : value);

// Public, reached from a link in an e-mail: the signed token is the proof, no sign-in. Opening the
// page changes nothing (mail scanners open links); the button does.
export default async function UnsubscribePage({ searchParams }: { searchParams: Promise<Search> }) {
  const search = await searchParams;
  const params = { u: first(search.u), c: first(search.c), k: first(search.k), t: first(search.t) };
  const target = verifyUnsubscribe(params);
  const view = target ? await describeOptOut(getDb(), target) : null;
  const done = first(search.done) === "1";

  return (
    <main className="mx-auto flex min-h-screen max-w-lg flex-col justify-center px-4 py-10">
      <div className="mb-6 flex items-center gap-2">
        <KeelsonMark className="h-9 w-9" />
        <p className="text-xl font-bold tracking-tight">Keelson</p>
      </div>
      <div className="grid gap-3 panel p-6 leading-relaxed">
        {!target ? (
          <>
            <h1 className="text-lg font-semibold">This unsubscribe link does not work</h1>
            <p className="text-ink-600 dark:text-ink-300">
              It may have been cut short or changed on the way. Use the link at the foot of the latest message, or ask
              your company administrator to change which messages you get.
            </p>
          </>
        ) : !view ? (
          <>
            <h1 className="text-lg font-semibold">Nothing to stop</h1>
            <p className="text-ink-600 dark:text-ink-300">
              This account is no longer part of the company, so Keelson sends it no messages.
            </p>
          </>
        ) : view.alreadyOptedOut ? (
          <>
            <h1 className="text-lg font-semibold">{done ? "Unsubscribed" : "Already unsubscribed"}</h1>
            <p role={done ? "status" : undefined}>
              <strong className="font-semibold">{view.email}</strong> no longer gets the {view.kindLabel} from Keelson
              for {view.companyName}.
            </p>
            <p className="text-ink-600 dark:text-ink-300">
              Other messages still arrive, and so do account messages such as password resets. To get the{" "}
              {view.kindLabel} again, sign in and switch it on under{" "}
              <Link href="/account" className="font-medium underline">
                My e-mail
              </Link>
              .
            </p>
          </>
        ) : (
          <>
            <h1 className="text-lg font-semibold">Stop the {view.kindLabel}?</h1>
            <p>
              <strong className="font-semibold">{view.email}</strong> will no longer get {MAIL_KIND_EFFECT[view.kind]}{" "}
              from Keelson for {view.companyName}.
            </p>
            <p className="text-ink-600 dark:text-ink-300">
              The work itself stays on the Backlog and the Fleet board; only this e-mail stops. Other messages still
              arrive.
            </p>
            <form method="post" action={`/api/unsubscribe?${new URLSearchParams(params as Record<string, string>)}`}>
              <button type="submit" className="btn-primary">
                Unsubscribe from the {view.kindLabel}
              </button>
            </form>
          </>
        )}
      </div>
      <p className="mt-4 text-ink-500 dark:text-ink-400">
        <Link href="/sign-in" className="underline">
          Sign in to Keelson
        </Link>
      </p>
    </main>
  );
}
