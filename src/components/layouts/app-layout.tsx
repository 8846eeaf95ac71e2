import { useState } from "react";
import { Navigate, NavLink, Outlet, useLocation, useNavigate } from "react-router";
import type { SessionUser } from "@shared/schemas/auth.ts";
import { ROLE_LABELS } from "@shared/schemas/auth.ts";
import { isStudio } from "@shared/permissions.ts";
import { useMe, useSignOut } from "@/features/session/api/session.ts";
import { useSettings } from "@/features/settings/api/settings.ts";
import { Logo } from "@/components/ui/logo.tsx";
import { Skeleton } from "@/components/ui/feedback.tsx";

type NavItem = { to: string; label: string; end?: boolean };

/** The left rail differs by role: studio staff, collectors and registrars each see their own sections (DEVELOPERS.md, "The look"). */
export function navFor(user: SessionUser): NavItem[] {
  if (isStudio(user)) {
    return [
      { to: "/", label: "Bench", end: true },
      { to: "/objects", label: "Register" },
      { to: "/mountings", label: "Mountings" },
      { to: "/planner", label: "Planner" },
      { to: "/condition", label: "Condition" },
      { to: "/custody", label: "Custody" },
      { to: "/clients", label: "Clients" },
      { to: "/documents", label: "Documents" },
      { to: "/studio", label: "Studio" },
    ];
  }
  if (user.role === "registrar")
    return [
      { to: "/objects", label: "Collection" },
      { to: "/condition", label: "Condition" },
      { to: "/clients", label: "Institution" },
    ];
  return [{ to: "/objects", label: "My collection" }];
}

export function AppLayout() {
  const me = useMe();
  const location = useLocation();
  const navigate = useNavigate();
  const signOut = useSignOut();
  const settings = useSettings(!!me.data);
  const [open, setOpen] = useState(false);

  if (me.isPending) {
    return (
      <div className="flex min-h-screen">
        <div className="w-60 border-r border-stone bg-paper-deep p-4">
          <Skeleton className="h-8 w-32" />
        </div>
        <div className="flex-1 p-8">
          <Skeleton className="mb-4 h-8 w-64" />
          <Skeleton className="h-64 w-full" />
        </div>
      </div>
    );
  }
  if (!me.data) {
    const next = location.pathname + location.search;
    return <Navigate to={`/sign-in${next !== "/" ? `?next=${encodeURIComponent(next)}` : ""}`} replace />;
  }
  const user = me.data;
  const items = navFor(user);

  return (
    <div className="min-h-screen md:flex">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-paper-sheet focus:px-3 focus:py-2">
        Skip to content
      </a>
      <aside className="print:hidden border-b border-stone bg-paper-deep md:sticky md:top-0 md:flex md:h-screen md:w-60 md:flex-col md:border-b-0 md:border-r">
        <div className="flex items-center justify-between px-5 py-4">
          <NavLink to={items[0]?.to ?? "/"} aria-label="Reversa, home">
            <Logo />
          </NavLink>
          <button type="button" className="rounded px-2 py-1 text-sm text-graphite md:hidden" aria-expanded={open} aria-controls="main-nav" onClick={() => setOpen((o) => !o)}>
            Menu
          </button>
        </div>
        {settings.data && <p className="hidden px-5 pb-3 text-xs text-graphite md:block">{settings.data.studioName}</p>}
        <nav id="main-nav" aria-label="Main" className={`${open ? "block" : "hidden"} px-3 pb-3 md:block md:flex-1`}>
          <ul className="space-y-0.5">
            {items.map((item) => (
              <li key={item.to}>
                <NavLink
                  to={item.to}
                  end={item.end}
                  onClick={() => setOpen(false)}
                  className={({ isActive }) =>
                    `block rounded-card px-3 py-2 text-sm font-medium ${isActive ? "bg-paper-sheet text-accent shadow-card" : "text-ink-soft hover:bg-paper-sheet/70"}`
                  }
                >
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        <div className={`${open ? "block" : "hidden"} border-t border-stone px-5 py-4 text-sm md:block`}>
          <p className="font-medium text-ink">{user.name}</p>
          <p className="text-xs text-graphite">{ROLE_LABELS[user.role]}</p>
          <button
            type="button"
            className="mt-2 text-sm font-medium text-accent hover:underline"
            onClick={() => signOut.mutate(undefined, { onSettled: () => navigate("/sign-in", { replace: true }) })}
          >
            Sign out
          </button>
        </div>
      </aside>
      <main id="main" className="min-w-0 flex-1 px-4 py-6 md:px-10 md:py-8 print:p-0">
        <Outlet />
      </main>
    </div>
  );
}
