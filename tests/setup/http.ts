import type { Agent } from "./test-app.ts";

/**
 * Collects a binary answer (a PDF, ZIP or image) into a Buffer; supertest parses only text and JSON by
 * itself. Use as `agent.post(url).buffer(true).parse(binary as never)`.
 */
export const binary = (res: NodeJS.ReadableStream, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on("data", (c: Buffer) => chunks.push(c));
  res.on("end", () => cb(null, Buffer.concat(chunks)));
};

/** GET whose answer, whatever its content type, comes back as a Buffer in `res.body`. */
export const getBinary = (agent: Agent, url: string) =>
  agent
    .get(url)
    .buffer(true)
    .parse(binary as never);
