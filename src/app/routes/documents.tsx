import { useAllDocuments } from "@/features/documents/api/documents.ts";
import { DocumentsList } from "@/features/documents/components/documents-list.tsx";
import { ButtonLink } from "@/components/ui/button.tsx";
import { PageHeader } from "@/components/ui/list-page.tsx";
import { ErrorNotice, SkeletonRows } from "@/components/ui/feedback.tsx";

export function Component() {
  const docs = useAllDocuments();
  return (
    <div className="space-y-5">
      <PageHeader
        gap="gap-3"
        title="Documents"
        intro="Every PDF the studio has issued, with its verification code. Dossiers and labels are made from an object's page; schedules and exports from a client's page."
        actions={
          <ButtonLink to="/verify" variant="secondary">
            Check a code
          </ButtonLink>
        }
      />
      <section className="rounded-card bg-paper-sheet p-4 shadow-card">
        {docs.isPending ? <SkeletonRows /> : docs.isError ? <ErrorNotice error={docs.error} /> : <DocumentsList items={docs.data} showObject />}
      </section>
    </div>
  );
}
