import express from "express";
import helmet from "helmet";
import { pinoHttp } from "pino-http";
import fs from "node:fs";
import path from "node:path";
import type { Config } from "./lib/config.ts";
import type { HistoryKeying } from "./lib/secret.ts";
import { useHistoryKey } from "./features/history/history.chain.ts";
import { createAuth } from "./lib/auth.ts";
import { createLogger } from "./lib/logger.ts";
import type { DbHandle } from "./db/client.ts";
import { createSessionResolver, requireAuth } from "./middleware/require-auth.ts";
import { apiNotFound, errorHandler } from "./middleware/error-handler.ts";
import { sameOriginWrites } from "./middleware/same-origin.ts";
import { signInThrottle } from "./middleware/sign-in-throttle.ts";
import { currentUser } from "./middleware/require-permission.ts";
import { sessionRoutes } from "./features/session/session.routes.ts";
import { settingsRoutes } from "./features/settings/settings.routes.ts";
import { clientRoutes } from "./features/clients/clients.routes.ts";
import { objectRoutes } from "./features/objects/objects.routes.ts";
import { mountPlanRoutes } from "./features/mount-plans/mount-plans.routes.ts";
import { historyRoutes } from "./features/history/history.routes.ts";
import { custodyRoutes } from "./features/custody/custody.routes.ts";
import { mountingsRegisterRoutes } from "./features/mountings/mountings-register.routes.ts";
import { mountingRoutes } from "./features/mountings/mountings.routes.ts";
import { photoRoutes } from "./features/photos/photos.routes.ts";
import { conditionRoutes } from "./features/condition/condition.routes.ts";
import { termRoutes } from "./features/condition/terms.routes.ts";
import { verifyRoutes } from "./features/documents/verify.routes.ts";
import { userRoutes } from "./features/users/users.routes.ts";
import { selectionDocumentsRoutes } from "./features/documents/selection-documents.routes.ts";
import { documentsRoutes } from "./features/documents/documents.routes.ts";
import { exportRoutes } from "./features/exports/exports.routes.ts";
import { setExportTimeLimit } from "./features/exports/export-pool.ts";
import { setRenderTimeLimit } from "./features/documents/render-pool.ts";

export type AppDeps = {
  config: Config & { authSecret: string } & HistoryKeying;
  database: DbHandle;
  /** Injected so tests can fix "now". */
  clock?: () => Date;
};

export function createApp({ config, database, clock = () => new Date() }: AppDeps) {
  const { db } = database;
  useHistoryKey(db, config.historyKey, config.checkpointsFile);
  setRenderTimeLimit(config.workTimeLimitMs);
  setExportTimeLimit(config.workTimeLimitMs);
  const logger = createLogger(config.logLevel);
  const auth = createAuth(db, config);
  const sessions = createSessionResolver(auth, db);
  const app = express();

  app.disable("x-powered-by");
  // API answers are not cached by validators; skipping the ETag hash saves work on every response.
  app.set("etag", false);
  app.set("trust proxy", "loopback");
  app.use(
    helmet({
      hsts: config.secureCookies,
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", "data:", "blob:"],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
          ...(config.secureCookies ? { upgradeInsecureRequests: [] } : {}),
        },
      },
    }),
  );
  // Request logs at "info"; with a quieter level the middleware is left out altogether.
  if (logger.isLevelEnabled("info"))
    app.use(
      pinoHttp({
        logger,
        autoLogging: { ignore: (req) => req.url === "/api/health" || !req.url?.startsWith("/api") },
        serializers: {
          req: (req: { method: string; url: string }) => ({ method: req.method, url: req.url }),
          res: (res: { statusCode: number }) => ({ status: res.statusCode }),
        },
      }),
    );

  app.get("/api/health", (_req, res) => {
    database.sqlite.prepare("select 1").get();
    res.json({ status: "ok" });
  });

  // Every write, sign-in included, must come from the studio's own pages (server/middleware/same-origin.ts).
  app.use("/api", sameOriginWrites(config.trustedOrigins));

  const json = express.json({ limit: "1mb" });
  // Sign-in: by address, refused after too many failures; by account, growing delays (server/middleware/sign-in-throttle.ts).
  const throttle = signInThrottle({ perAddress: config.loginRateLimit, accountDelayAfter: config.loginAccountDelayAfter, delayMs: config.loginDelayMs });
  app.post("/api/session", json, ...throttle.middleware);
  // better-auth is called in-process (auth.api) by /api/session and requireAuth; its own HTTP
  // routes are not mounted, so sign-up and the rest of its surface are not reachable.
  app.use("/api/session", json, sessionRoutes(auth, sessions, throttle.signedIn));

  app.use("/api", verifyRoutes(db));

  // Everything below needs a session; bodies are parsed only once the caller is known.
  app.use("/api", requireAuth(sessions));
  app.use("/api", json);
  app.get("/api/me", (req, res) => {
    res.json(currentUser(req));
  });
  app.use("/api", userRoutes(db));
  app.use("/api/settings", settingsRoutes(db, config));
  app.use("/api/clients", clientRoutes(db));
  app.use("/api", mountPlanRoutes(db));
  app.use("/api", historyRoutes(db));
  app.use("/api", custodyRoutes(db, clock));
  app.use("/api", mountingsRegisterRoutes(db));
  app.use("/api", mountingRoutes(db));
  app.use("/api", photoRoutes(db, config));
  app.use("/api", conditionRoutes(db, clock));
  app.use("/api", termRoutes(db));
  app.use("/api", selectionDocumentsRoutes(db, clock, { publicUrl: config.publicUrl, publicUrlGiven: config.publicUrlGiven }, config.uploadsDir));
  app.use("/api", documentsRoutes(db, config, clock));
  app.use("/api", exportRoutes(db, config, clock));
  app.use("/api/objects", objectRoutes(db, clock));
  app.use("/api", apiNotFound);
  app.use("/api", errorHandler);

  if (config.clientDir && fs.existsSync(config.clientDir)) {
    const dir = config.clientDir;
    app.use(
      express.static(dir, {
        index: false,
        maxAge: "1h",
        setHeaders: (res, file) => {
          if (file.includes(`${path.sep}assets${path.sep}`)) res.setHeader("Cache-Control", "public, max-age=31536000, immutable");
        },
      }),
    );
    app.get("/{*spa}", (_req, res) => {
      res.setHeader("Cache-Control", "no-cache");
      res.sendFile(path.join(dir, "index.html"));
    });
  }
  app.use(errorHandler);
  return { app, auth, logger };
}
