// The Content-Security-Policy of Keelson's pages, built per request by proxy.ts with a fresh nonce:
// Next reads the nonce back from the request's policy and puts it on its own inline scripts
// (node_modules/next/dist/docs/01-app/02-guides/content-security-policy.md), the root layout puts
// it on the theme script, and 'strict-dynamic' lets those scripts load the app's chunks.
// No import of server/env.ts: proxy.ts passes what it needs, and the unit test needs nothing.

export type PolicyOptions = {
  nonce: string;
  /** `next dev`: React rebuilds server error stacks with eval; never in production. */
  development: boolean;
  /** Served over https (BETTER_AUTH_URL): ask the browser to upgrade any stray http:// link. */
  https: boolean;
};

export function pageSecurityPolicy({ nonce, development, https }: PolicyOptions): string {
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${development ? " 'unsafe-eval'" : ""}`,
    // 'unsafe-inline' for styles: React renders `style=` attributes (tree indents, the crew-hours
    // bars), which a nonce cannot cover (nonces apply to elements, not attributes), and FullCalendar
    // injects a <style> element from its script. A nonce here would also switch 'unsafe-inline'
    // off. Styles cannot run code; scripts stay locked to the nonce.
    "style-src 'self' 'unsafe-inline'",
    // blob: the preview of a photo just taken (work order → completion); data: inline SVG in CSS.
    "img-src 'self' blob: data:",
    // data: FullCalendar's icon font ships inside its stylesheet.
    "font-src 'self' data:",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'none'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(https ? ["upgrade-insecure-requests"] : []),
  ];
  return directives.join("; ");
}

/** A fresh, unguessable nonce (128 bits), base64 as CSP writes it. */
export function newNonce(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return btoa(String.fromCharCode(...bytes));
}

/** The nonce of a policy built above (the request's copy), for an inline script of our own. */
export function nonceOf(policy: string | null): string | undefined {
  return policy?.match(/'nonce-([^']+)'/)?.[1];
}
