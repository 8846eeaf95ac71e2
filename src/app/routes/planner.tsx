import { useStudio } from "@/features/settings/api/settings.ts";
import { Planner } from "@/features/planner/components/planner.tsx";
import { SkeletonRows } from "@/components/ui/feedback.tsx";

/** The planner on its own: a quick answer at the counter, nothing saved. */
export function Component() {
  const { settings, words } = useStudio();
  if (!settings) return <SkeletonRows />;
  return (
    <div className="space-y-5">
      <header className="print:hidden">
        <h1 className="text-2xl font-bold tracking-tight">Planner</h1>
        <p className="text-sm text-graphite">
          Window, borders, glazing and frame for a sheet, recomputed as you type. Nothing here is saved; plan from an object's page to keep it.
        </p>
      </header>
      <h1 className="hidden text-xl font-bold print:block">
        {settings.studioName} · {words.Mount} plan
      </h1>
      <Planner settings={{ unit: settings.unit, minOverlapMm: settings.minOverlapMm, rebateClearanceMm: settings.rebateClearanceMm, framePresets: settings.framePresets, words }} />
    </div>
  );
}
