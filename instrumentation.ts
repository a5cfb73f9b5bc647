// Next runs register() once when the server starts: the configuration is checked then, so a bad
// variable stops `next start` with a message naming it rather than failing the first request.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { envOrExit } = await import("./server/env");
  envOrExit();
}
