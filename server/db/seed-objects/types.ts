import type { ObjectCreateInput } from "../../../shared/schemas/objects.ts";

/** One demo object and the demo client it belongs to; every maker, title and owner is invented for the demo. */
export type DemoObject = Omit<ObjectCreateInput, "clientId" | "objectNumber"> & { owner: "varga" | "wrenfold" | "aalto" | "saltmarsh" };
