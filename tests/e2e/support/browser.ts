import { afterAll, beforeAll, expect } from "vitest";
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

export const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";
export const DEMO_PASSWORD = "reversa-demo";

/** Debian's Chromium, headless, with a fresh profile and no background traffic. */
export async function launch(): Promise<{ browser: Browser; context: BrowserContext; close: () => Promise<void> }> {
  const userDataDir = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-chromium-"));
  const context = await chromium.launchPersistentContext(userDataDir, {
    executablePath: CHROMIUM,
    headless: true,
    viewport: { width: 1280, height: 900 },
    args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
  });
  // Waits are for things to happen, not for speed: a loaded CI machine may take a while to render a page.
  context.setDefaultTimeout(120_000);
  context.setDefaultNavigationTimeout(120_000);
  return {
    browser: context.browser() as Browser,
    context,
    close: async () => {
      await context.close();
      fs.rmSync(userDataDir, { recursive: true, force: true });
    },
  };
}

export type Watch = { consoleErrors: string[]; foreignRequests: string[] };

/** Records console errors and any request that leaves the app's own origin. */
export function watch(page: Page, baseUrl: string): Watch {
  const w: Watch = { consoleErrors: [], foreignRequests: [] };
  const origin = new URL(baseUrl).origin;
  page.on("console", (m) => {
    if (m.type() === "error") w.consoleErrors.push(m.text());
  });
  page.on("pageerror", (e) => w.consoleErrors.push(String(e)));
  page.on("request", (r) => {
    const u = r.url();
    if (!u.startsWith(origin) && !u.startsWith("data:") && !u.startsWith("blob:")) w.foreignRequests.push(u);
  });
  return w;
}

export async function signIn(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
}

/** One Chromium per spec file: call at the top of the file; `fresh()` gives a signed-out page and its watch. */
export function browserSession(baseUrl: string) {
  let ctx: Awaited<ReturnType<typeof launch>> | undefined;
  beforeAll(async () => {
    ctx = await launch();
  });
  afterAll(async () => {
    await ctx?.close();
  });
  return {
    async fresh(): Promise<{ page: Page; w: Watch }> {
      if (!ctx) throw new Error("browserSession: the browser is not launched yet (call fresh() inside a test)");
      await ctx.context.clearCookies();
      const page = await ctx.context.newPage();
      return { page, w: watch(page, baseUrl) };
    },
    /** A fresh page signed in as a demo user (`framer@reversa.test`, …), and its watch. */
    async signedIn(email: string): Promise<{ page: Page; w: Watch }> {
      const fresh = await this.fresh();
      await signIn(fresh.page, baseUrl, email);
      return fresh;
    },
  };
}

/** Searches the register for `search` (the object number unless given) and opens the object by its number's link. */
export async function openObject(page: Page, baseUrl: string, objectNumber: string, search = objectNumber) {
  await page.goto(`${baseUrl}/objects?q=${encodeURIComponent(search)}`);
  await page.getByRole("link", { name: objectNumber }).click();
}

/** The end of a journey: no console error, no request to another origin; then the page closes. */
export async function finish(page: Page, w: Watch) {
  expect(w.consoleErrors).toEqual([]);
  expect(w.foreignRequests).toEqual([]);
  await page.close();
}
