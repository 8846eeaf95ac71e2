import pino from "pino";

export function createLogger(level: string) {
  return pino({
    level,
    redact: { paths: ["req.headers.cookie", "req.headers.authorization", "res.headers['set-cookie']"], censor: "[hidden]" },
  });
}
export type Logger = ReturnType<typeof createLogger>;
