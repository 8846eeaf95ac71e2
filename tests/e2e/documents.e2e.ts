import { describe, expect, inject, it } from "vitest";
import { signIn, useBrowser } from "./support/browser.ts";

const baseUrl = inject("baseUrl");
const browser = useBrowser(baseUrl);

describe("documents journey", () => {
  it("when the collector issues their object's dossier, then its code checks out on the public page and a made-up code does not", async () => {
    const { page, w } = await browser.fresh();
    await signIn(page, baseUrl, "collector@reversa.test");
    await page.goto(`${baseUrl}/objects?q=2026-0003`);
    await page.getByRole("link", { name: "2026-0003" }).click();
    const download = page.waitForEvent("download");
    await page.getByRole("button", { name: "Object dossier (PDF)" }).click();
    const file = await download;
    expect(file.suggestedFilename()).toMatch(/^dossier-2026-0003-.+\.pdf$/);
    const status = page.getByText(/Issued with verification code/);
    await status.waitFor();
    const code = (await status.textContent())!.match(/code ([0-9A-F-]+)/)![1];
    await page.getByTestId("documents").getByText(code).waitFor();

    // Signed out, anyone holding the document can check it.
    await page.context().clearCookies();
    await page.goto(`${baseUrl}/verify/${code}`);
    await page.getByText("This document was issued by the studio").waitFor();
    await page.getByText(/Object dossier for object 2026-0003/).waitFor();
    await page.goto(`${baseUrl}/verify/AAAA-BBBB-CCCC`);
    await page.getByText("Unknown code").waitFor();
    expect(w.consoleErrors).toEqual([]);
    expect(w.foreignRequests).toEqual([]);
    await page.close();
  });
});
