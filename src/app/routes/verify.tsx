import { useState } from "react";
import { Link, useNavigate, useParams } from "react-router";
import { useVerification } from "@/features/documents/api/documents.ts";
import { LogoMark } from "@/components/ui/logo.tsx";
import { Button } from "@/components/ui/button.tsx";
import { TextField } from "@/components/ui/field.tsx";
import { ErrorNotice, Notice, Skeleton } from "@/components/ui/feedback.tsx";
import { formatDateTime } from "@/lib/format.ts";

/** Public: anyone holding a Reversa document can check that it was issued, for which object and when. */
export function Component() {
  const { code = "" } = useParams();
  const navigate = useNavigate();
  const [typed, setTyped] = useState(code);
  const v = useVerification(code);
  return (
    <main className="mx-auto max-w-lg px-4 py-12">
      <div className="mb-6 flex items-center gap-3">
        <LogoMark size={36} />
        <h1 className="text-2xl font-bold tracking-tight">Check a document</h1>
      </div>
      <p className="mb-4 text-sm text-graphite">
        Every document Reversa issues carries a verification code in its header. Enter it to see whether the document was issued, for which object and when.
      </p>
      <form
        className="flex items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          navigate(`/verify/${encodeURIComponent(typed.trim().toUpperCase())}`);
        }}
      >
        <TextField
          label="Verification code"
          wrapClassName="flex-1"
          className="font-mono uppercase"
          placeholder="XXXX-XXXX-XXXX"
          value={typed}
          onChange={(e) => setTyped(e.target.value)}
        />
        <Button type="submit">Check</Button>
      </form>
      <div className="mt-6" aria-live="polite">
        {code && v.isPending && <Skeleton className="h-16 w-full" />}
        {v.isError && <ErrorNotice title="Could not check" error={v.error} />}
        {v.data &&
          (v.data.valid ? (
            <Notice tone="pass" title="This document was issued by the studio">
              <p>
                {v.data.kindLabel}
                {v.data.objectNumber ? ` for object ${v.data.objectNumber}` : ""}, issued {formatDateTime(v.data.issuedAt)}. Code <span className="font-mono">{v.data.code}</span>.
              </p>
              {v.data.sha256 ? (
                <div className="mt-2">
                  <p>
                    The issued file has {v.data.pages} page{v.data.pages === 1 ? "" : "s"} and this SHA-256 fingerprint. A copy whose fingerprint differs (for example from{" "}
                    <span className="font-mono">sha256sum</span> or <span className="font-mono">certutil -hashfile … SHA256</span>) is not the file as issued.
                  </p>
                  <p className="mt-1 break-all font-mono text-xs" data-testid="fingerprint">
                    {v.data.sha256}
                  </p>
                </div>
              ) : (
                <p className="mt-2">This document was issued before Reversa kept file fingerprints, so only its code can be checked.</p>
              )}
            </Notice>
          ) : (
            <Notice tone="fail" title="Unknown code">
              No document with the code <span className="font-mono">{v.data.code}</span> was issued. Check the code for typing mistakes; if it is right, the document did not come
              from this studio.
            </Notice>
          ))}
      </div>
      <p className="mt-8 text-sm">
        <Link to="/" className="text-accent underline">
          Sign in to Reversa
        </Link>
      </p>
    </main>
  );
}
