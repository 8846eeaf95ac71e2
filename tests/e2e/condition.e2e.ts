import { describe, expect, inject, it } from "vitest";
import sharp from "sharp";
import { browserSession, finish, openObject } from "./support/browser.ts";

const baseUrl = inject("baseUrl");
const browser = browserSession(baseUrl);

describe("condition journeys", () => {
  it("when a framer compares the two demo reports of 2026-0001, then the abrasion shows as new and the tear as worsened", async () => {
    const { page, w } = await browser.signedIn("framer@reversa.test");
    await openObject(page, baseUrl, "2026-0001");
    await expect.poll(() => page.getByTestId("condition-reports").getByRole("listitem").count()).toBe(2);
    await page.getByRole("link", { name: "Compare two reports" }).click();
    const table = page.getByTestId("comparison");
    await table.getByRole("row", { name: /New.*abrasion/i }).waitFor();
    await table.getByRole("row", { name: /Worsened.*tear/i }).waitFor();
    await table.getByRole("row", { name: /Unchanged.*foxing/i }).waitFor();
    await finish(page, w);
  });

  it("when an object has a mould finding, then its page shows the handling caution", async () => {
    const { page, w } = await browser.signedIn("framer@reversa.test");
    await openObject(page, baseUrl, "2026-0009");
    await page.getByText("Handling caution").first().waitFor();
    await page
      .getByText(/nitrile gloves and a respirator/)
      .first()
      .waitFor();
    await finish(page, w);
  });

  it("when a framer uploads a photo and pins a finding on it, then the signed report shows the numbered marker", async () => {
    const { page, w } = await browser.signedIn("framer@reversa.test");
    await openObject(page, baseUrl, "2026-0002");
    const jpeg = await sharp({ create: { width: 600, height: 800, channels: 3, background: { r: 230, g: 220, b: 200 } } })
      .jpeg()
      .toBuffer();
    await page.locator('input[type="file"]').first().setInputFiles({ name: "pears-recto.jpg", mimeType: "image/jpeg", buffer: jpeg });
    await page.getByRole("button", { name: "Add the photo" }).click();
    await page.locator('img[src*="/thumb"]').first().waitFor();

    await page.getByRole("link", { name: "New condition report" }).click();
    await page.getByRole("heading", { name: "New condition report" }).waitFor();
    await page.locator('label:has(img[src*="/thumb"]) input[type="checkbox"]').first().check();
    const photo = page.getByTestId("photo-markers").locator("img");
    await photo.waitFor();
    const box = (await photo.boundingBox())!;
    await page.mouse.click(box.x + box.width * 0.25, box.y + box.height * 0.3);
    await page.getByLabel("Term").first().selectOption("foxing");
    await page.getByLabel("Severity").first().selectOption("moderate");
    await page.getByLabel("Overall rating").selectOption("fair");
    await page.getByLabel("Summary").fill("Stable; scattered foxing in the upper left.");
    await page.getByRole("button", { name: "Save draft" }).click();
    await page.getByRole("button", { name: "Sign and lock" }).click();
    await page.getByText("Signed", { exact: true }).waitFor();
    await page.getByTestId("photo-markers").locator('[data-marker="1"]').waitFor();
    await page.getByTestId("findings").getByText("foxing").waitFor();
    await finish(page, w);
  });
});
