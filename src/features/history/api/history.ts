import { useInfiniteQuery } from "@tanstack/react-query";
import type { EventType, HistoryEvent } from "@shared/schemas/history.ts";
import { api, qs } from "@/lib/api-client.ts";
import { objectHistoryKey, rootKeys } from "@/lib/query-keys.ts";

export const historyKeys = {
  all: rootKeys.history,
  object: objectHistoryKey,
  list: (objectId: string, types: EventType[]) => [...objectHistoryKey(objectId), types] as const,
};

export function useHistory(objectId: string, types: EventType[]) {
  return useInfiniteQuery({
    queryKey: historyKeys.list(objectId, types),
    initialPageParam: undefined as string | undefined,
    queryFn: ({ pageParam }) =>
      api.get<{ items: HistoryEvent[]; nextBefore: string | null }>(
        `/api/objects/${encodeURIComponent(objectId)}/history${qs({ types: types.join(",") || undefined, before: pageParam, limit: 50 })}`,
      ),
    getNextPageParam: (last) => last.nextBefore ?? undefined,
  });
}
