import type { Db } from "../../db/client.ts";
import { MountingDataSchema, type MountingData } from "../../../shared/schemas/mountings.ts";
import type { PlanResult } from "../../../shared/domain/mount-plan/index.ts";
import { recordPlan, type CatalogueFacts } from "../../../shared/domain/mounting.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { findObject, type ObjectRow } from "../objects/objects.repo.ts";
import { revision, type MountingRow, type RevisionRow } from "./mountings.repo.ts";

/** What a mounting record shows: its data, the catalogue facts its checks read, and the plan recomputed from both. */
export type MountingDetail = {
  row: MountingRow;
  data: MountingData;
  /** The object's catalogue facts the plan was computed with, so a screen recomputes the same plan. */
  catalogue: CatalogueFacts;
  /** recordPlan of the data, the catalogue and the studio's settings: never a stored copy. */
  result: PlanResult;
};

/** The catalogue facts a record's checks read. */
function catalogueOf(o: ObjectRow): CatalogueFacts {
  return {
    objectType: o.objectType,
    photoProcess: o.photoProcess,
    sensitivities: o.sensitivities,
    medium: o.medium,
    support: o.support,
    borderLeftMm: o.borderLeftMm,
    borderTopMm: o.borderTopMm,
    borderRightMm: o.borderRightMm,
    borderBottomMm: o.borderBottomMm,
  };
}

/**
 * A mounting record as the record page, the API and every document show it: its current revision (or
 * the one given), read through the contract, with the plan and checks recomputed from the saved input,
 * the object's catalogue and the record's materials. Null when the revision or the object is missing.
 * The one place this is assembled: mountings.service (each revision it answers) and the PDFs call it.
 */
export function mountingDetail(db: Db, row: MountingRow, given: { object?: ObjectRow; revision?: RevisionRow } = {}): MountingDetail | null {
  const rev = given.revision ?? revision(db, row.id, row.currentRevision);
  if (!rev) return null;
  const o = given.object ?? findObject(db, row.objectId);
  if (!o) return null;
  const data = MountingDataSchema.parse(rev.data);
  return { row, data, catalogue: catalogueOf(o), result: recordPlan(data, o, getSettings(db)) };
}
