import { useAllDocuments } from "@/features/documents/api/documents.ts";
import { DocumentsList } from "@/features/documents/components/documents-list.tsx";
import { ButtonLink } from "@/components/ui/button.tsx";
import { Notice, SkeletonRows } from "@/components/ui/feedback.tsx";

export function Component() {
  const docs = useAllDocuments();
  return (
    <div className="space-y-5">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold tracking-tight">Documents</h1>
          <p className="text-sm text-graphite">Every PDF the studio has issued, with its verification code. Dossiers and labels are made from an object's page; schedules and exports from a client's page.</p>
        </div>
        <ButtonLink to="/verify" variant="secondary">Check a code</ButtonLink>
      </header>
      <section className="rounded-card bg-paper-sheet p-4 shadow-card">
        {docs.isPending ? <SkeletonRows /> : docs.isError ? <Notice tone="fail">{docs.error.message}</Notice> : <DocumentsList items={docs.data} showObject />}
      </section>
    </div>
  );
}
