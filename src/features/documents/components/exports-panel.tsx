import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button.tsx";
import { Notice } from "@/components/ui/feedback.tsx";
import { api } from "@/lib/api-client.ts";
import { download } from "@/lib/api-client.ts";

const DATASETS = [
  { id: "objects", label: "Objects" },
  { id: "mountings", label: "Mountings" },
  { id: "condition", label: "Condition reports, with findings and recommendations" },
  { id: "custody", label: "Custody (every hand-over in and out)" },
  { id: "valuations", label: "Valuations" },
] as const;

type Job = { state: "running" | "done" | "failed"; progress: number; message?: string };

/** A client's records as CSV (opens in a spreadsheet) or JSON, and everything at once as a ZIP with photos. */
export function ExportsPanel({ clientId, showValuations, mayTakeOriginals = false }: { clientId: string; showValuations: boolean; mayTakeOriginals?: boolean }) {
  const [error, setError] = useState<string | null>(null);
  const [originals, setOriginals] = useState(false);
  const [jobId, setJobId] = useState<string | null>(null);
  const [job, setJob] = useState<Job | null>(null);

  useEffect(() => {
    if (!jobId) return;
    let stop = false;
    const tick = async () => {
      try {
        const j = await api.get<Job>(`/api/exports/${encodeURIComponent(jobId)}`);
        if (stop) return;
        setJob(j);
        if (j.state === "running") setTimeout(tick, 500);
        else if (j.state === "done") await download(`/api/exports/${encodeURIComponent(jobId)}/download`, { method: "GET", fallbackName: "reversa-archive.zip" });
      } catch (e) {
        if (!stop) setError(e instanceof Error ? e.message : String(e));
      }
    };
    void tick();
    return () => {
      stop = true;
    };
  }, [jobId]);

  const get = async (dataset: string, format: "csv" | "json") => {
    setError(null);
    try {
      await download(`/api/clients/${encodeURIComponent(clientId)}/exports/${dataset}.${format}`, { method: "GET", fallbackName: `${dataset}.${format}` });
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    }
  };

  return (
    <div className="space-y-3 text-sm">
      {error && <Notice tone="fail" title="Not exported">{error}</Notice>}
      <ul className="divide-y divide-stone-light">
        {DATASETS.filter((d) => d.id !== "valuations" || showValuations).map((d) => (
          <li key={d.id} className="flex items-center justify-between gap-3 py-2">
            <span>{d.label}</span>
            <span className="flex gap-2">
              <Button variant="quiet" className="px-2 py-1" onClick={() => get(d.id, "csv")}>CSV</Button>
              <Button variant="quiet" className="px-2 py-1" onClick={() => get(d.id, "json")}>JSON</Button>
            </span>
          </li>
        ))}
      </ul>
      <div className="flex flex-wrap items-center gap-3">
        <Button
          variant="secondary"
          disabled={job?.state === "running"}
          onClick={async () => {
            setError(null);
            setJob(null);
            try {
              const r = await api.post<{ jobId: string }>(`/api/clients/${encodeURIComponent(clientId)}/exports/archive`, { originals });
              setJobId(r.jobId);
            } catch (e) {
              setError(e instanceof Error ? e.message : String(e));
            }
          }}
        >
          Everything as a ZIP (photos and PDFs)
        </Button>
        {mayTakeOriginals && (
          <label className="inline-flex items-center gap-2 text-ink-soft">
            <input type="checkbox" className="h-4 w-4 accent-accent" checked={originals} onChange={(e) => setOriginals(e.target.checked)} />
            Photo originals, with their camera and place metadata (studio only)
          </label>
        )}
        {job && (
          <span className="flex items-center gap-2" role="status">
            <progress max={1} value={job.progress} className="h-2 w-40" aria-label="Archive progress" />
            <span className="text-graphite num">{job.state === "done" ? `${job.message ?? "Ready"} Downloading.` : job.state === "failed" ? job.message ?? "Failed" : `${Math.round(job.progress * 100)} %`}</span>
          </span>
        )}
      </div>
      <p className="text-xs text-graphite">CSV files are UTF-8 with a byte-order mark so spreadsheets open them; column names follow Spectrum 5.0 units of information where one fits, and every value is in words. The ZIP adds the photos (full size, camera and place metadata removed), each object's dossier, its signed condition reports and custody receipts as PDFs, and a manifest giving each file's SHA-256.</p>
    </div>
  );
}
