import { createBrowserRouter } from "react-router";
import { AppLayout } from "@/components/layouts/app-layout.tsx";
import { RouteError } from "./routes/route-error.tsx";

// Pages are split per route to keep the first load small.
export const router = createBrowserRouter([
  { path: "/sign-in", lazy: () => import("./routes/sign-in.tsx"), errorElement: <RouteError /> },
  { path: "/verify", lazy: () => import("./routes/verify.tsx"), errorElement: <RouteError /> },
  { path: "/verify/:code", lazy: () => import("./routes/verify.tsx"), errorElement: <RouteError /> },
  {
    path: "/",
    element: <AppLayout />,
    errorElement: <RouteError />,
    children: [
      { index: true, lazy: () => import("./routes/bench.tsx") },
      { path: "objects", lazy: () => import("./routes/register.tsx") },
      { path: "objects/new", lazy: () => import("./routes/object-new.tsx") },
      { path: "objects/:id", lazy: () => import("./routes/object.tsx") },
      { path: "objects/:id/edit", lazy: () => import("./routes/object-edit.tsx") },
      { path: "objects/:id/plan", lazy: () => import("./routes/object-plan.tsx") },
      { path: "objects/:id/mountings/new", lazy: () => import("./routes/mounting-edit.tsx") },
      { path: "mountings", lazy: () => import("./routes/mountings.tsx") },
      { path: "mountings/:id", lazy: () => import("./routes/mounting.tsx") },
      { path: "mountings/:id/edit", lazy: () => import("./routes/mounting-edit.tsx") },
      { path: "mountings/:id/correct", lazy: () => import("./routes/mounting-edit.tsx") },
      { path: "planner", lazy: () => import("./routes/planner.tsx") },
      { path: "clients", lazy: () => import("./routes/clients.tsx") },
      { path: "clients/new", lazy: () => import("./routes/client-edit.tsx") },
      { path: "clients/:id", lazy: () => import("./routes/client.tsx") },
      { path: "clients/:id/edit", lazy: () => import("./routes/client-edit.tsx") },
      { path: "custody", lazy: () => import("./routes/custody.tsx") },
      { path: "condition", lazy: () => import("./routes/condition-register.tsx") },
      { path: "condition/:id", lazy: () => import("./routes/condition-report.tsx") },
      { path: "condition/:id/edit", lazy: () => import("./routes/condition-edit.tsx") },
      { path: "condition/:id/correct", lazy: () => import("./routes/condition-edit.tsx") },
      { path: "objects/:id/condition/new", lazy: () => import("./routes/condition-edit.tsx") },
      { path: "objects/:id/condition/compare", lazy: () => import("./routes/condition-compare.tsx") },
      { path: "documents", lazy: () => import("./routes/documents.tsx") },
      { path: "studio", lazy: () => import("./routes/studio.tsx") },
      { path: "*", lazy: () => import("./routes/not-found.tsx") },
    ],
  },
]);
