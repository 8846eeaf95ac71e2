import type { ComponentProps, ReactNode } from "react";
import { Link } from "react-router";
import { can, type Action, type Actor } from "@shared/permissions.ts";
import type { ApiError } from "@/lib/api-client.ts";
import { Button, ButtonLink } from "@/components/ui/button.tsx";
import { TextAreaField } from "@/components/ui/field.tsx";
import { ErrorNotice, Notice } from "@/components/ui/feedback.tsx";

/** Above a revisioned record's page or form: its object's number (a link to the object) and title. */
export function ObjectLine({ objectId, objectNumber, title }: { objectId: string; objectNumber: string; title: string }) {
  return (
    <p className="text-sm font-semibold text-accent num">
      <Link to={`/objects/${objectId}`} className="hover:underline">
        {objectNumber}
      </Link>{" "}
      · {title}
    </p>
  );
}

/** A revisioned record's page head: its object, its title, a line of facts (status, who, revision…), and its actions on the right. */
export function RecordHead({
  record,
  title,
  facts,
  actions,
}: {
  record: { objectId: string; objectNumber: string; objectTitle: string };
  title: ReactNode;
  facts: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <header className="flex flex-wrap items-end justify-between gap-3">
      <div>
        <ObjectLine objectId={record.objectId} objectNumber={record.objectNumber} title={record.objectTitle} />
        <h1 className="text-2xl font-bold tracking-tight">{title}</h1>
        <p className="mt-1 flex flex-wrap items-center gap-2 text-sm text-graphite">{facts}</p>
      </div>
      {actions}
    </header>
  );
}

/**
 * The top of a revisioned record's form: why the last save failed, and, for a correction, what a
 * correction does (`note`) and the reason it must give (the "say why" field, `correctionReason`).
 */
export function RevisionedFormHead({
  error,
  correcting,
  note,
  reason,
}: {
  error: ApiError | null;
  correcting: boolean;
  note: string;
  reason: Omit<ComponentProps<typeof TextAreaField>, "label">;
}) {
  return (
    <>
      {error && <ErrorNotice title="Not saved" error={error} />}
      {correcting && (
        <div className="rounded-card bg-paper-sheet p-4 shadow-card">
          <Notice tone="info" title="A correction">
            {note}
          </Notice>
          <TextAreaField label="Reason for the correction" wrapClassName="mt-3" {...reason} />
        </div>
      )}
    </>
  );
}

/**
 * An edit page's gate, once the object's query has settled: the object when the user may `action` on
 * it, or what the page shows instead (why the object could not be read, or `readOnly`).
 */
export function editGate<O extends { clientId: string | null }>(
  object: { error: Error | null; data: O | undefined },
  user: Actor | null | undefined,
  action: Action,
  readOnly: string,
): { ok: true; o: O } | { ok: false; refusal: ReactNode } {
  if (object.error || !object.data)
    return {
      ok: false,
      refusal: <ErrorNotice title="Object not found" error={object.error} />,
    };
  if (!can(user, action, { clientId: object.data.clientId }))
    return {
      ok: false,
      refusal: (
        <Notice tone="warn" title="Read only">
          {readOnly}
        </Notice>
      ),
    };
  return { ok: true, o: object.data };
}

/**
 * A revisioned record's actions for those who may write it: a draft is edited or locked (`lock`:
 * complete, sign); a locked record is corrected. `children` add the feature's own actions.
 */
export function RevisionedActions({
  draft,
  recordTo,
  correctLabel,
  lock,
  children,
}: {
  draft: boolean;
  /** The record's page; its draft is edited at …/edit and it is corrected at …/correct. */
  recordTo: string;
  correctLabel: string;
  lock: { label: string; onLock: () => void; pending: boolean };
  children?: ReactNode;
}) {
  return (
    <div className="flex flex-wrap gap-2">
      {draft && (
        <ButtonLink to={`${recordTo}/edit`} variant="secondary">
          Edit draft
        </ButtonLink>
      )}
      {draft && (
        <Button onClick={lock.onLock} disabled={lock.pending}>
          {lock.label}
        </Button>
      )}
      {!draft && (
        <ButtonLink to={`${recordTo}/correct`} variant="secondary">
          {correctLabel}
        </ButtonLink>
      )}
      {children}
    </div>
  );
}
