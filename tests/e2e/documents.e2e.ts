import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, inject, it } from "vitest";
import { browserSession, finish, openObject } from "./support/browser.ts";
import { at, present } from "../setup/lists.ts";

const baseUrl = inject("baseUrl");
const browser = browserSession(baseUrl);

describe("documents journey", () => {
  it("when the collector issues their object's dossier, then its code checks out on the public page and a made-up code does not", async () => {
    const { page, w } = await browser.signedIn("collector@reversa.test");
    await openObject(page, baseUrl, "2026-0003");
    const download = page.waitForEvent("download");
    await page.getByRole("button", { name: "Object dossier (PDF)" }).click();
    const file = await download;
    expect(file.suggestedFilename()).toMatch(/^dossier-2026-0003-.+\.pdf$/);
    const status = page.getByText(/Issued with verification code/);
    await status.waitFor();
    const code = at(present((await status.textContent())?.match(/code ([0-9A-F-]+)/), "the verification code in the status"), 1);
    await page.getByTestId("documents").getByText(code).waitFor();

    // Signed out, anyone holding the document can check it.
    await page.context().clearCookies();
    await page.goto(`${baseUrl}/verify/${code}`);
    await page.getByText("This document was issued by the studio").waitFor();
    await page.getByText(/Object dossier for object 2026-0003/).waitFor();
    await page.goto(`${baseUrl}/verify/AAAA-BBBB-CCCC`);
    await page.getByText("Unknown code").waitFor();
    await finish(page, w);
  });

  it("when the registrar filters their collection and asks for the schedule, then it lists exactly the objects on screen", async () => {
    const { page, w } = await browser.signedIn("registrar@reversa.test");
    await page.goto(`${baseUrl}/objects`);
    await page.locator('section[aria-label="Objects"] tbody tr').first().waitFor();
    const filteredList = page.waitForResponse((r) => r.url().includes("/api/objects?") && r.url().includes("status=with-owner"));
    await page.getByLabel("Status").selectOption({ label: "With the owner" });
    await filteredList;
    await page.locator('section[aria-label="Objects"][aria-busy="false"] tbody tr').first().waitFor();
    const shown = (await page.locator('section[aria-label="Objects"] tbody tr td:first-child').allTextContents()).map((x) => x.trim().split(/\s/)[0]);
    expect(shown.length).toBeGreaterThan(0);
    const download = page.waitForEvent("download");
    await page.getByRole("button", { name: "Schedule of values for these objects (PDF)" }).click();
    const file = await download;
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-e2e-schedule-"));
    const pdf = path.join(dir, "schedule.pdf");
    await file.saveAs(pdf);
    const text = spawnSync("/usr/bin/pdftotext", ["-layout", pdf, "-"], { encoding: "utf8" }).stdout;
    fs.rmSync(dir, { recursive: true, force: true });
    expect(text).toContain("status: with the owner");
    const listed = [...text.matchAll(/^\s*(\d{4}-\d{4})\b/gm)].map((m) => m[1]);
    expect(listed.sort()).toEqual(shown.sort());
    await finish(page, w);
  });

  it("when the studio runs on this machine's own address, then the framer is warned before printing labels and no label button is offered", async () => {
    const { page, w } = await browser.signedIn("framer@reversa.test");
    await openObject(page, baseUrl, "2026-0003");
    // The e2e server's PUBLIC_URL is a 127.0.0.1 address: a QR code to it would open nothing anywhere else.
    await page.getByText("Labels are not ready to print").waitFor();
    await page.getByText(/PUBLIC_URL is http:\/\/127\.0\.0\.1/).waitFor();
    expect(await page.getByRole("button", { name: "Back label (PDF)" }).count()).toBe(0);
    await finish(page, w);
  });
});
