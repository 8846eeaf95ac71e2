import { Router } from "express";
import type { Db } from "../../db/client.ts";
import { StudioSettingsSchema } from "../../../shared/schemas/settings.ts";
import { requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { getSettings, saveSettings } from "./settings.repo.ts";

export function settingsRoutes(db: Db) {
  const r = Router();
  r.get("/", requirePermission("settings:read"), (_req, res) => {
    res.json(getSettings(db));
  });
  r.put("/", requirePermission("settings:update"), validate({ body: StudioSettingsSchema }), (req, res) => {
    res.json(saveSettings(db, input(req, "body", StudioSettingsSchema)));
  });
  return r;
}
