import { describe, expect, inject, it } from "vitest";
import { browserSession, finish, signIn } from "./support/browser.ts";

const baseUrl = inject("baseUrl");
const browser = browserSession(baseUrl);

const freshPage = () => browser.fresh();

describe("framer journey: record an object and find it", () => {
  it("when a framer signs in after asking for a page, then they land on that page", async () => {
    const { page, w } = await freshPage();
    await page.goto(`${baseUrl}/clients`);
    await page.waitForURL(/\/sign-in\?next=%2Fclients/);
    await page.getByLabel("E-mail address").fill("framer@reversa.test");
    await page.getByLabel("Password").fill("not-the-password");
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page.getByText("do not match an account").waitFor()).resolves.toBeUndefined();
    await page.getByLabel("Password").fill("reversa-demo");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(`${baseUrl}/clients`);
    await page.getByRole("heading", { name: "Clients" }).waitFor();
    expect(w.foreignRequests).toEqual([]);
    // The only console error is the browser's own line for the refused sign-in (HTTP 401).
    expect(w.consoleErrors.filter((e) => !/status of 401/.test(e))).toEqual([]);
    await page.close();
  });

  it("when a framer creates an object, then it opens and the register finds it by title and by number", async () => {
    const { page, w } = await freshPage();
    await signIn(page, baseUrl, "framer@reversa.test");
    await page.goto(`${baseUrl}/objects/new`);
    const number = await page.getByLabel("Object number").inputValue();
    expect(number).toMatch(/^\d{4}-\d{4}$/);
    await page.getByLabel("Title").fill("Quince branch, e2e study");
    await page.getByLabel("Maker").fill("Test Maker Orla");
    await page.getByLabel("Object type").selectOption("drawing");
    // Inches with a fraction are read and stored in millimetres.
    await page.getByRole("radio", { name: "inches" }).click();
    await page.getByLabel("Sheet width (in)").fill("11 3/4");
    await page.getByLabel("Sheet height (in)").fill("15-1/2");
    await page.getByLabel("Owner").selectOption({ label: "Benedikt Aalto-Rhee" });
    await page.getByRole("button", { name: "Save object" }).click();
    await page.waitForURL(/\/objects\/[0-9a-f-]{36}$/);
    await page.getByRole("heading", { name: "Quince branch, e2e study" }).waitFor();
    // 11 3/4 in = 298.45 mm and 15 1/2 in = 393.7 mm (1 in = 25.4 mm exactly: NIST HB 44, App. C)
    await page.getByText("298.5 × 393.5 mm").or(page.getByText("298.5 × 394 mm")).first().waitFor();

    await page.goto(`${baseUrl}/objects`);
    await page.getByLabel("Search objects").fill("quince");
    await page.getByRole("link", { name: number }).waitFor();
    await expect.poll(() => page.getByRole("row").count(), { timeout: 60_000 }).toBe(2); // header + the one match
    await page.getByLabel("Search objects").fill(number);
    await page.getByRole("link", { name: number }).click();
    await page.getByRole("heading", { name: "Quince branch, e2e study" }).waitFor();
    await finish(page, w);
  });

  it("when the object number is already taken, then the form says so beside the field and keeps what was typed", async () => {
    const { page, w } = await freshPage();
    await signIn(page, baseUrl, "framer@reversa.test");
    await page.goto(`${baseUrl}/objects/new`);
    await page.getByLabel("Object number").fill("2026-0001");
    await page.getByLabel("Title").fill("A second estuary");
    await page.getByLabel("Sheet width (mm)").fill("210");
    await page.getByLabel("Sheet height (mm)").fill("297");
    await page.getByLabel("Owner").selectOption({ label: "Odile Varga-Pennick" });
    await page.getByRole("button", { name: "Save object" }).click();
    const fieldError = page.getByText("2026-0001 is already used by another object; choose another number.");
    await fieldError.waitFor();
    const numberField = page.getByLabel("Object number");
    expect(await numberField.getAttribute("aria-invalid")).toBe("true");
    expect(await numberField.getAttribute("aria-describedby")).toContain(await fieldError.getAttribute("id"));
    expect(await page.getByLabel("Title").inputValue()).toBe("A second estuary");
    expect(await page.getByLabel("Sheet width (mm)").inputValue()).toBe("210");
    expect(page.url()).toMatch(/\/objects\/new$/);
    expect(w.consoleErrors.filter((e) => !/status of 409/.test(e))).toEqual([]);
    await page.close();
  });
});

describe("collector journey: only their own objects", () => {
  it("when a collector signs in, then the register lists only their objects and another client's object is not found", async () => {
    const { page: admin } = await freshPage();
    // Find another client's object id as the studio sees it.
    await signIn(admin, baseUrl, "admin@reversa.test");
    const other = await admin.evaluate(async () => {
      const r = await fetch("/api/objects?q=night%20tram");
      return (await r.json()).items[0] as { id: string; clientName: string };
    });
    expect(other.clientName).toBe("Benedikt Aalto-Rhee");
    await admin.close();

    const { page, w } = await freshPage();
    await signIn(page, baseUrl, "collector@reversa.test");
    await page.waitForURL(`${baseUrl}/objects`);
    await page.getByRole("heading", { name: "My collection" }).waitFor();
    await page.getByRole("link", { name: "2026-0001" }).waitFor();
    const owners = await page.evaluate(async () => {
      const r = await fetch("/api/objects?pageSize=200");
      return [...new Set(((await r.json()).items as { clientName: string }[]).map((i) => i.clientName))];
    });
    expect(owners).toEqual(["Odile Varga-Pennick"]);
    await expect(page.getByText("Night tram").count()).resolves.toBe(0);

    await page.goto(`${baseUrl}/objects/${other.id}`);
    await page.getByText("Object not found").waitFor();
    await expect(page.getByText("Night tram").count()).resolves.toBe(0);
    // The collector has no Clients, Bench or Studio in the rail.
    await expect(page.getByRole("navigation", { name: "Main" }).getByRole("link").allTextContents()).resolves.toEqual(["My collection"]);
    expect(w.consoleErrors.filter((e) => !/status of 404/.test(e))).toEqual([]);
    expect(w.foreignRequests).toEqual([]);
    await page.close();
  });
});
