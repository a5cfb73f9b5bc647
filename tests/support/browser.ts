// Debian's chromium driven by playwright-core: no browser download, flags for a closed network.
import { mkdirSync } from "node:fs";
import path from "node:path";
import { type Browser, chromium, type Page } from "playwright-core";

export const BASE_URL = process.env.KEELSON_TEST_URL ?? "http://127.0.0.1:3000";
export const OUTPUT = process.env.TEST_OUTPUT ?? path.resolve("test-output");

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
}

/** One browser and page for a test file: call in beforeAll, close in afterAll. */
export async function openPage(viewport = { width: 1280, height: 900 }): Promise<{ browser: Browser; page: Page }> {
  const browser = await launchBrowser();
  return { browser, page: await browser.newPage({ viewport }) };
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(OUTPUT, { recursive: true });
  const file = path.join(OUTPUT, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

export async function signInThroughForm(page: Page, email: string, password: string): Promise<void> {
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel("E-mail", { exact: true }).fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
}

/** Signs out whoever was signed in on the page and signs `email` in through the form. */
export async function switchUser(page: Page, email: string, password: string): Promise<void> {
  await page.context().clearCookies();
  await page.goto("about:blank");
  await signInThroughForm(page, email, password);
}
