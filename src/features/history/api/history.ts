import { useInfiniteQuery } from "@tanstack/react-query";
import type { EventType, HistoryEvent } from "@shared/schemas/history.ts";
import { api, qs } from "@/lib/api-client.ts";

export function useHistory(objectId: string, types: EventType[]) {
  return useInfiniteQuery({
    queryKey: ["history", objectId, types],
    initialPageParam: undefined as string | undefined,
    queryFn: ({ pageParam }) =>
      api.get<{ items: HistoryEvent[]; nextBefore: string | null }>(
        `/api/objects/${encodeURIComponent(objectId)}/history${qs({ types: types.join(",") || undefined, before: pageParam, limit: 50 })}`,
      ),
    getNextPageParam: (last) => last.nextBefore ?? undefined,
  });
}
