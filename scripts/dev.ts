// `npm run dev`: the API on :3001 (restarting on change) and Vite with hot reload on :5173, proxying /api.
import { spawn } from "node:child_process";

const apiPort = process.env.API_PORT ?? "3001";
const env = { ...process.env, API_PORT: apiPort };
const children = [
  spawn("npx", ["tsx", "watch", "server/index.ts"], { stdio: "inherit", env: { ...env, PORT: apiPort, TRUSTED_ORIGINS: "http://localhost:5173,http://127.0.0.1:5173" } }),
  spawn("npx", ["vite"], { stdio: "inherit", env }),
];
const stop = () => {
  for (const c of children) c.kill("SIGTERM");
};
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
for (const c of children)
  c.on("exit", (code) => {
    if (code) {
      stop();
      process.exit(code);
    }
  });
