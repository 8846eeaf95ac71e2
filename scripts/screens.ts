// Takes screenshots of the main journeys for a look by eye: `npx tsx scripts/screens.ts http://localhost:3000 .tmp/shots`
import { chromium } from "playwright-core";
import fs from "node:fs";

const base = process.argv[2] ?? "http://localhost:3000";
const out = process.argv[3] ?? ".tmp/shots";
fs.mkdirSync(out, { recursive: true });
const browser = await chromium.launch({
  executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
  args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
});
const page = await browser.newPage({ viewport: { width: 1360, height: 900 } });
page.on("console", (m) => m.type() === "error" && console.log("console error:", m.text()));
const shot = async (name: string) => page.screenshot({ path: `${out}/${name}.png`, fullPage: true });
const signIn = async (email: string) => {
  await page.goto(`${base}/sign-in`);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill("reversa-demo");
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
};
await page.goto(`${base}/objects`);
await page.waitForURL(/sign-in/);
await shot("01-sign-in");
await signIn("framer@reversa.test");
await page.waitForLoadState("networkidle");
await shot("02-bench");
await page.goto(`${base}/objects`);
await page.waitForLoadState("networkidle");
await shot("03-register");
await page.getByRole("link", { name: "2026-0010" }).click();
await page.waitForLoadState("networkidle");
await shot("04-object");
await page.goto(`${base}/objects/new`);
await page.waitForLoadState("networkidle");
await page.getByRole("button", { name: "Save object" }).click();
await shot("05-new-object-errors");
await page.goto(`${base}/clients`);
await page.waitForLoadState("networkidle");
await shot("06-clients");
await page.goto(`${base}/studio`);
await page.waitForLoadState("networkidle");
await shot("07-studio");
await page.setViewportSize({ width: 390, height: 844 });
await page.goto(`${base}/objects`);
await page.waitForLoadState("networkidle");
await shot("08-register-mobile");
await browser.close();
