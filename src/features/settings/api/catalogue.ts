import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { settingsKeys } from './keys';

export type CatalogueResource = 'products' | 'extras' | 'tax-rates';

export async function listCatalogue<T>(resource: CatalogueResource, signal?: AbortSignal): Promise<T[]> {
  return (await api.get<{ items: T[] }>(`/api/catalogue/${resource}`, undefined, signal)).items;
}
export const catalogueQueryOptions = <T>(resource: CatalogueResource) =>
  queryOptions({ queryKey: settingsKeys.catalogue(resource), queryFn: ({ signal }) => listCatalogue<T>(resource, signal) });
export function useCatalogue<T>(resource: CatalogueResource) {
  return useQuery(catalogueQueryOptions<T>(resource));
}

/** Create (no id), update (id) or delete a catalogue row; the list refetches afterwards. */
export function useCatalogueMutation(resource: CatalogueResource) {
  const qc = useQueryClient();
  const done = () => qc.invalidateQueries({ queryKey: settingsKeys.catalogue(resource) });
  return {
    save: useMutation({
      mutationFn: ({ id, body }: { id?: string; body: unknown }) =>
        id ? api.patch(`/api/catalogue/${resource}/${encodeURIComponent(id)}`, body) : api.post(`/api/catalogue/${resource}`, body),
      onSuccess: done,
    }),
    remove: useMutation({ mutationFn: (id: string) => api.delete(`/api/catalogue/${resource}/${encodeURIComponent(id)}`), onSuccess: done }),
  };
}
