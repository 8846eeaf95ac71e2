import { afterAll, afterEach } from "vitest";
import { format } from "node:util";

// The house rule (DEVELOPERS.md, Tests): a console error fails the test. Calls are still printed, then the test
// (or, outside any test, the file) fails with what was logged.
const original = console.error.bind(console);
let logged: string[] = [];

console.error = (...args: unknown[]) => {
  logged.push(format(...args));
  original(...args);
};

function check(where: string) {
  if (logged.length === 0) return;
  const lines = logged.map((l) => `  ${l.split("\n")[0]}`).join("\n");
  logged = [];
  throw new Error(`console.error was called ${where}:\n${lines}`);
}

afterEach(() => check("during this test"));
afterAll(() => check("in this file's setup or teardown"));
