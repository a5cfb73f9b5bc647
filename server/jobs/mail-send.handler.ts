// The outbox drain (mail-send.ts says when it runs). The follow-up timer lives in this process, so
// a retry due within the minute does not wait for the cron.
import type { Db } from "@/db/client";
import { nextMailDueAt, sendDueMail } from "@/server/mail/sender";
import type { JobHandler } from "./definition";

let followUp: NodeJS.Timeout | null = null;
// One drain at a time in this process (the cron, a request and the timer may coincide): a call
// that finds one running waits for it and runs once more, so mail queued meanwhile is not missed.
let running: Promise<unknown> = Promise.resolve();

function drain(db: Db) {
  const next = running.then(() => drainNow(db));
  running = next.catch(() => undefined);
  return next;
}

async function drainNow(db: Db) {
  const total = { sent: 0, retried: 0, failed: 0 };
  for (;;) {
    const round = await sendDueMail(db, { limit: 100 });
    total.sent += round.sent;
    total.retried += round.retried;
    total.failed += round.failed;
    if (round.claimed < 100) break;
  }
  const next = await nextMailDueAt(db);
  const wait = next ? next.getTime() - Date.now() : Infinity;
  if (wait < 60_000) {
    if (followUp) clearTimeout(followUp);
    followUp = setTimeout(
      () => {
        followUp = null;
        drain(db)
          .then((t) => t.sent + t.retried + t.failed && console.log(`[worker] mail-send follow-up: ${summary(t)}`))
          .catch((error) => console.error("[worker] mail-send follow-up failed", error));
      },
      Math.max(wait, 0) + 250,
    );
    followUp.unref();
  }
  return total;
}

const summary = ({ sent, retried, failed }: { sent: number; retried: number; failed: number }) =>
  `${sent} sent, ${retried} to retry, ${failed} given up`;

const mailSendHandler: JobHandler<object> = async (_payload, { db }) => {
  const total = await drain(db);
  return total.sent + total.retried + total.failed ? summary(total) : "";
};
export default mailSendHandler;

export function stop(): void {
  if (followUp) clearTimeout(followUp);
  followUp = null;
}
