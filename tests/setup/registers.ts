import type { ObjectListItem } from "../../shared/schemas/objects.ts";
import type { Agent } from "./test-app.ts";

/** One page of GET /api/objects. */
export type ObjectListBody = { items: ObjectListItem[]; total: number; page: number; pageSize: number };

/** GET /api/objects?query, failing loudly on anything but 200. */
export async function listObjects(agent: Agent, query: string): Promise<ObjectListBody> {
  const res = await agent.get(`/api/objects?${query}`);
  if (res.status !== 200) throw new Error(`GET /api/objects?${query} answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body as ObjectListBody;
}

/** The object numbers of a page, in order. */
export const objectNumbers = (body: ObjectListBody) => body.items.map((i) => i.objectNumber);
