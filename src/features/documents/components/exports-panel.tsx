import { useEffect, useRef, useState } from "react";
import { DATASETS, type Dataset, type Format } from "@shared/schemas/exports.ts";
import { Button } from "@/components/ui/button.tsx";
import { Notice } from "@/components/ui/feedback.tsx";
import { downloadArchive, downloadDataset, startArchive, useExportJob } from "../api/exports.ts";

/** The datasets as the panel names them; the ids are the shared contract's. */
const DATASET_LABELS: Record<Dataset, string> = {
  objects: "Objects",
  mountings: "Mountings",
  condition: "Condition reports, with findings and recommendations",
  custody: "Custody (every hand-over in and out)",
  valuations: "Valuations",
};

const message = (e: unknown) => (e instanceof Error ? e.message : String(e));

/** A client's records as CSV (opens in a spreadsheet) or JSON, and everything at once as a ZIP with photos. */
export function ExportsPanel({ clientId, showValuations, mayTakeOriginals = false }: { clientId: string; showValuations: boolean; mayTakeOriginals?: boolean }) {
  const [error, setError] = useState<string | null>(null);
  const [originals, setOriginals] = useState(false);
  const [jobId, setJobId] = useState<string | null>(null);
  const poll = useExportJob(jobId);
  const job = jobId ? poll.data : undefined;
  const downloaded = useRef<string | null>(null);

  // Once the archive is built, save it, once per job.
  useEffect(() => {
    if (!jobId || job?.state !== "done" || downloaded.current === jobId) return;
    downloaded.current = jobId;
    downloadArchive(jobId).catch((e) => setError(message(e)));
  }, [jobId, job?.state]);

  useEffect(() => {
    if (poll.error) setError(message(poll.error));
  }, [poll.error]);

  const get = async (dataset: Dataset, format: Format) => {
    setError(null);
    try {
      await downloadDataset(clientId, dataset, format);
    } catch (e) {
      setError(message(e));
    }
  };

  return (
    <div className="space-y-3 text-sm">
      {error && (
        <Notice tone="fail" title="Not exported">
          {error}
        </Notice>
      )}
      <ul className="divide-y divide-stone-light">
        {DATASETS.filter((d) => d !== "valuations" || showValuations).map((d) => (
          <li key={d} className="flex items-center justify-between gap-3 py-2">
            <span>{DATASET_LABELS[d]}</span>
            <span className="flex gap-2">
              <Button variant="quiet" className="px-2 py-1" onClick={() => get(d, "csv")}>
                CSV
              </Button>
              <Button variant="quiet" className="px-2 py-1" onClick={() => get(d, "json")}>
                JSON
              </Button>
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
            setJobId(null);
            try {
              setJobId((await startArchive(clientId, originals)).jobId);
            } catch (e) {
              setError(message(e));
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
            <span className="text-graphite num">
              {job.state === "done" ? `${job.message ?? "Ready"} Downloading.` : job.state === "failed" ? (job.message ?? "Failed") : `${Math.round(job.progress * 100)} %`}
            </span>
          </span>
        )}
      </div>
      <p className="text-xs text-graphite">
        CSV files are UTF-8 with a byte-order mark so spreadsheets open them; column names follow Spectrum 5.0 units of information where one fits, and every value is in words. The
        ZIP adds the photos (full size, camera and place metadata removed), each object's dossier, its signed condition reports and custody receipts as PDFs, and a manifest giving
        each file's SHA-256.
      </p>
    </div>
  );
}
