import { describe, expect, inject, it } from "vitest";
import { browserSession, finish, openObject } from "./support/browser.ts";

const baseUrl = inject("baseUrl");
const browser = browserSession(baseUrl);

describe("reframing journey", () => {
  it("when a framer reframes a mounted object, then the new record supersedes the old, whose drawing and hinges stay readable from the history", async () => {
    const { page, w } = await browser.signedIn("framer@reversa.test");
    // 2026-0014 was mounted once in the demo studio (two T-hinges at the top).
    await openObject(page, baseUrl, "2026-0014");
    await page.getByTestId("current-mount").getByText("2 T-hinges").waitFor();
    await page.getByRole("link", { name: "Record a reframing" }).click();
    await page.getByRole("heading", { name: "Record a reframing" }).waitFor();

    // Drag the first hinge 20 mm to the right on the drawing (the SVG is in mm).
    const offset = page.getByLabel("From corner").first();
    const before = Number(await offset.inputValue());
    const hinge = page.locator('[data-testid="plan-drawing"] rect[data-role="hinge"][data-hinge="0"]');
    const box = (await hinge.boundingBox())!;
    const svg = (await page.locator('[data-testid="plan-drawing"]').first().boundingBox())!;
    const viewBoxWidth = Number((await page.locator('[data-testid="plan-drawing"]').first().getAttribute("viewBox"))!.split(" ")[2]);
    const pxPerMm = svg.width / viewBoxWidth;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width / 2 + 10 * pxPerMm, box.y + box.height / 2, { steps: 4 });
    await page.mouse.move(box.x + box.width / 2 + 20 * pxPerMm, box.y + box.height / 2, { steps: 4 });
    await page.mouse.up();
    await expect.poll(async () => Number(await offset.inputValue())).toBeGreaterThanOrEqual(before + 18);
    // …and with the keyboard: arrow right moves it 1 mm.
    await hinge.focus();
    const dragged = Number(await offset.inputValue());
    await page.keyboard.press("ArrowRight");
    await expect.poll(async () => Number(await offset.inputValue())).toBe(dragged + 1);

    await page.getByLabel("Glazing", { exact: true }).selectOption("uv-acrylic");
    await page.getByLabel("How to undo this mounting").fill("Same two T-hinges, moved; release with a damp blotter from the back.");
    await page.getByRole("button", { name: "Save draft" }).click();
    await page.getByRole("button", { name: "Complete and lock" }).click();
    await page.getByText("Current", { exact: true }).waitFor();

    await page.getByRole("link", { name: "2026-0014" }).first().click();
    await page.getByTestId("current-mount").getByText("UV acrylic").waitFor();
    await page.getByText("Superseded").waitFor();
    const timeline = page.getByTestId("timeline");
    await timeline.getByText("Reframed", { exact: true }).waitFor();
    // The older record opens from the history, as it was.
    await timeline.locator("li", { hasText: "Mounted" }).getByRole("link", { name: "Open the mounting record" }).click();
    await page.getByText("Superseded", { exact: true }).waitFor();
    await page.getByText("superseded by a later mounting").waitFor();
    await expect(page.locator('[data-testid="plan-drawing"] rect[data-role="hinge"]').count()).resolves.toBe(2);
    await page.getByText("1. top edge").waitFor();
    await finish(page, w);
  });

  it("when the collector opens their mounted object, then they read the mount and history but cannot change it", async () => {
    const { page, w } = await browser.signedIn("collector@reversa.test");
    await openObject(page, baseUrl, "2026-0003");
    await page.getByTestId("current-mount").getByText("T-hinges").waitFor();
    await page.getByTestId("timeline").getByText("Reframed", { exact: true }).waitFor();
    await expect(page.getByRole("link", { name: "Record a reframing" }).count()).resolves.toBe(0);
    await page.getByRole("link", { name: "Open the mounting record" }).first().click();
    await page.getByTestId("undo-notes").waitFor();
    await expect(page.getByRole("link", { name: "Correct the record" }).count()).resolves.toBe(0);
    await finish(page, w);
  });
});

describe("correcting a completed record", () => {
  it("when a framer opens the correction form of a completed record, then it loads from the record without a failed request", async () => {
    const { page, w } = await browser.signedIn("framer@reversa.test");
    // 2026-0003 carries a completed mounting in the demo studio.
    await openObject(page, baseUrl, "2026-0003");
    // The Mount section's button (the history lists the same link for each mounting).
    await page.locator("#mount").getByRole("link", { name: "Open the mounting record" }).click();
    await page.getByRole("link", { name: "Correct the record" }).click();
    await page.getByRole("heading", { name: "Correct the mounting record" }).waitFor();
    await page.getByLabel("Reason for the correction").waitFor();
    // The form learns its object from the record: nothing is asked for before that is known
    // (no /api/objects/ or /api/objects//plan), so no request fails and the console stays clean.
    await page.waitForLoadState("networkidle");
    await finish(page, w);
  });
});
