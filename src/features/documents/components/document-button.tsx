import { useState } from "react";
import { Button } from "@/components/ui/button.tsx";
import { download } from "@/lib/api-client.ts";

/** Issues a document and saves the PDF; says so, with its verification code, or says what went wrong. */
export function DocumentButton({
  url,
  label,
  body,
  fallbackName,
  onIssued,
  variant = "secondary",
}: {
  url: string;
  label: string;
  body?: unknown;
  fallbackName: string;
  onIssued?: () => void;
  variant?: "primary" | "secondary";
}) {
  const [state, setState] = useState<{ busy: boolean; message: string | null; error: boolean }>({ busy: false, message: null, error: false });
  return (
    <span className="inline-flex flex-col gap-1">
      <Button
        variant={variant}
        disabled={state.busy}
        onClick={async () => {
          setState({ busy: true, message: null, error: false });
          try {
            const r = await download(url, { method: "POST", body, fallbackName });
            setState({ busy: false, message: r.code ? `Issued with verification code ${r.code}.` : "Saved.", error: false });
            onIssued?.();
          } catch (e) {
            setState({ busy: false, message: e instanceof Error ? e.message : String(e), error: true });
          }
        }}
      >
        {state.busy ? "Preparing…" : label}
      </Button>
      {state.message && (
        <span role="status" className={`text-xs ${state.error ? "text-fail" : "text-graphite"}`}>
          {state.message}
        </span>
      )}
    </span>
  );
}
