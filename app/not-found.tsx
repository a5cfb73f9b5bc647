import Link from "next/link";
import { KeelsonMark } from "./_components/keelson-mark";

export default function NotFound() {
  return (
    <main className="mx-auto flex min-h-[60vh] max-w-md flex-col items-start justify-center gap-3 px-4">
      <KeelsonMark className="h-8 w-8" />
      <h1 className="text-lg font-bold">Not found</h1>
      <p className="text-ink-600 dark:text-ink-300">
        There is nothing here, or it belongs to a vessel you are not assigned to. Your company administrator can
        assign you to a vessel.
      </p>
      <Link href="/" className="btn-quiet">
        Back to your vessels
      </Link>
    </main>
  );
}
