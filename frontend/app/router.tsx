import { createBrowserRouter } from 'react-router-dom';
import { alloyListQueryOptions } from '../features/catalogue/api/list-alloys';
import { apiQueryFromFilters, filtersFromSearch } from '../features/catalogue/filters';
import { CatalogueRoute } from '../features/catalogue/routes/catalogue-route';
import { queryClient } from '../lib/query-client';
import { Layout } from './layout';
import { RouteError } from './route-error';

export const router = createBrowserRouter([
  {
    element: <Layout />,
    errorElement: <RouteError />,
    hydrateFallbackElement: <p className="p-6 text-sm">Loading Conductory…</p>,
    children: [
      {
        errorElement: <RouteError />,
        children: [
          {
            index: true,
            element: <CatalogueRoute />,
            loader: async ({ request }) => {
              const filters = filtersFromSearch(new URL(request.url).searchParams);
              await queryClient.prefetchQuery(alloyListQueryOptions(apiQueryFromFilters(filters)));
              return null;
            },
            // Typing in the search box changes the URL: the table refetches itself, no loader.
            shouldRevalidate: () => false,
          },
          {
            path: 'alloys/:slug',
            // Screens past the Catalogue load on first visit, keeping the first page small.
            lazy: async () => {
              const [{ AlloySheetRoute }, { alloyQueryOptions }] = await Promise.all([
                import('../features/alloy-sheet/routes/alloy-sheet-route'),
                import('../features/alloy-sheet/api/get-alloy'),
              ]);
              return {
                Component: AlloySheetRoute,
                loader: async ({ params }: { params: { slug?: string } }) => {
                  await queryClient.ensureQueryData(alloyQueryOptions(params.slug ?? ''));
                  return null;
                },
              };
            },
          },
          {
            path: 'match',
            lazy: async () => ({
              Component: (await import('../features/match/routes/match-route')).MatchRoute,
            }),
          },
          {
            path: 'layer-lab',
            lazy: async () => ({
              Component: (await import('../features/layer-lab/routes/layer-lab-route'))
                .LayerLabRoute,
            }),
          },
          {
            path: 'pulse-bench',
            lazy: async () => ({
              Component: (await import('../features/pulse-bench/routes/pulse-bench-route'))
                .PulseBenchRoute,
            }),
          },
          { path: '*', element: <RouteError /> },
        ],
      },
    ],
  },
]);
