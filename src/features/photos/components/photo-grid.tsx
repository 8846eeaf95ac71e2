import { useState } from "react";
import { PHOTO_KIND_LABELS } from "@shared/schemas/photos.ts";
import { Badge, EmptyState, ErrorNotice, Skeleton } from "@/components/ui/feedback.tsx";
import { useObjectPhotos } from "../api/photos.ts";
import { Lightbox, photoLabel, takenLine } from "./lightbox.tsx";

type Props = {
  objectId: string;
  /** Only this condition report's photos. */
  reportId?: string;
  /** From can(user, "photo:write", { clientId }): the viewer then offers to change kind and caption. */
  canUpload?: boolean;
};

/** The object's photos as thumbnails with their kind and caption; one opens in the viewer. */
export function PhotoGrid({ objectId, reportId, canUpload = false }: Props) {
  const q = useObjectPhotos(objectId, reportId);
  const [open, setOpen] = useState<number | null>(null);

  if (q.isPending)
    return (
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-3" role="status" aria-label="Loading photos">
        {Array.from({ length: 3 }, (_, i) => (
          // biome-ignore lint/suspicious/noArrayIndexKey: placeholder tiles with nothing but their position
          <Skeleton key={i} className="aspect-[4/3] w-full" />
        ))}
      </div>
    );
  if (q.isError) return <ErrorNotice title="The photos could not be loaded" error={q.error} />;
  const photos = q.data;
  if (photos.length === 0)
    return (
      <EmptyState title="No photos yet">
        {canUpload
          ? "Photos record the object's state: recto and verso on arrival, details of each finding, raking light for cockling, UV for old repairs. Add them above."
          : "Photos taken for condition reports appear here."}
      </EmptyState>
    );

  return (
    <>
      <ul aria-label="Photos" className="grid grid-cols-2 gap-3 sm:grid-cols-3">
        {photos.map((p, i) => {
          const taken = takenLine(p);
          return (
            <li key={p.id} className="min-w-0">
              <button
                type="button"
                onClick={() => setOpen(i)}
                className="group block w-full overflow-hidden rounded-card border border-stone bg-paper-sheet text-left shadow-card hover:border-graphite-light"
                aria-label={`Open ${photoLabel(p)} in the viewer`}
              >
                <span className="block aspect-[4/3] bg-paper-deep">
                  <img src={p.urls.thumb} alt="" loading="lazy" decoding="async" className="h-full w-full object-contain" />
                </span>
                <span className="block space-y-1 px-2.5 py-2">
                  <Badge tone="accent">{PHOTO_KIND_LABELS[p.kind] ?? p.kind}</Badge>
                  {p.caption && (
                    <span className="block truncate text-sm text-ink" title={p.caption}>
                      {p.caption}
                    </span>
                  )}
                  {taken && <span className="block text-xs text-graphite">{taken}</span>}
                </span>
              </button>
            </li>
          );
        })}
      </ul>
      {open !== null && photos[open] && <Lightbox photos={photos} index={open} onIndexChange={setOpen} onClose={() => setOpen(null)} canEdit={canUpload} />}
    </>
  );
}
