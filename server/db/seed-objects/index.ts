import type { DemoObject } from "./types.ts";
import { VARGA_OBJECTS } from "./varga.ts";
import { WRENFOLD_OBJECTS } from "./wrenfold.ts";
import { AALTO_OBJECTS } from "./aalto.ts";
import { SALTMARSH_OBJECTS } from "./saltmarsh.ts";

export type { DemoObject } from "./types.ts";

/** The demo studio's objects in the order their numbers are given (2026-0001 onwards), owner by owner. */
export const DEMO_OBJECTS: DemoObject[] = [...VARGA_OBJECTS, ...WRENFOLD_OBJECTS, ...AALTO_OBJECTS, ...SALTMARSH_OBJECTS];
