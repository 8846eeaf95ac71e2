/**
 * The first element of every query key, one per feature. Each feature builds its own keys from its root
 * (src/features/<name>/api/*.ts, `<name>Keys`); a feature that changes another's data invalidates it by
 * the root here, since features do not import each other.
 */
export const rootKeys = {
  me: ["me"],
  settings: ["settings"],
  users: ["users"],
  clients: ["clients"],
  objects: ["objects"],
  mountings: ["mountings"],
  condition: ["condition"],
  conditionTerms: ["condition-terms"],
  custody: ["custody"],
  documents: ["documents"],
  exports: ["exports"],
  verify: ["verify"],
  history: ["history"],
  photos: ["photos"],
  plans: ["plans"],
} as const;

/** One object's history, every filter of it: whatever changes the object invalidates this. */
export const objectHistoryKey = (objectId: string) => [...rootKeys.history, objectId] as const;
