// Runs in the browser before any other client code of Keelson's (Next's instrumentation-client).
// zod 4, on building its first object schema, probes whether it may compile parsers with
// `new Function("")`. Under the pages' Content-Security-Policy (no 'unsafe-eval', proxy.ts) the
// probe fails quietly, yet the browser reports a CSP violation on every page with a form. jitless
// skips the probe (allowsEval in node_modules/zod/v4/core/util.js); parsing is the same, only
// without the compiled fast path, which the browser would refuse anyway.
// Only zod's core config: the whole zod namespace would add ~32 kB to every page's first visit.
import { config } from "zod/v4/core";

config({ jitless: true });
