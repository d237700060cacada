import { createBrowserRouter, Navigate, type RouteObject } from 'react-router-dom';
import { alloyListQueryOptions } from '../features/catalogue/api/list-alloys';
import { apiQueryFromFilters, filtersFromSearch } from '../features/catalogue/filters';
import { CatalogueRoute } from '../features/catalogue/routes/catalogue-route';
import { queryClient } from '../lib/query-client';
import { Layout } from './layout';
import { NotFoundPage } from './not-found';
import { RequireRole } from './require-role';
import { RouteError } from './route-error';

/** Administration and its pages (the guard around it is in the router below). */
const ADMIN: RouteObject = {
  path: 'admin',
  lazy: async () => ({
    Component: (await import('../features/admin/routes/admin-route')).AdminRoute,
  }),
  children: [
    { index: true, element: <Navigate to="/admin/users" replace /> },
    {
      path: 'users',
      lazy: async () => ({
        Component: (await import('../features/admin/routes/admin-pages')).UsersPage,
      }),
    },
    {
      path: 'keys',
      lazy: async () => ({
        Component: (await import('../features/admin/routes/admin-pages')).KeysPage,
      }),
    },
    {
      path: 'audit',
      lazy: async () => ({
        Component: (await import('../features/admin/routes/admin-pages')).AuditPage,
      }),
    },
    {
      path: 'outbox',
      lazy: async () => ({
        Component: (await import('../features/admin/routes/admin-pages')).OutboxPage,
      }),
    },
  ],
};

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
          {
            path: 'checks',
            lazy: async () => ({
              Component: (await import('../features/checks/routes/checks-route')).ChecksRoute,
            }),
          },
          {
            path: 'sort-planner',
            lazy: async () => ({
              Component: (await import('../features/sort-planner/routes/sort-planner-route'))
                .SortPlannerRoute,
            }),
          },
          {
            path: 'sign-in',
            lazy: async () => ({
              Component: (await import('../features/access/routes/sign-in-route')).SignInRoute,
            }),
          },
          {
            path: 'sign-up',
            lazy: async () => ({
              Component: (await import('../features/access/routes/sign-up-route')).SignUpRoute,
            }),
          },
          {
            path: 'verify',
            lazy: async () => ({
              Component: (await import('../features/access/routes/verify-route')).VerifyRoute,
            }),
          },
          {
            path: 'reset',
            lazy: async () => ({
              Component: (await import('../features/access/routes/reset-route')).ResetRoute,
            }),
          },
          {
            element: <RequireRole screen="the Review Desk" roles={['curator', 'admin']} />,
            children: [
              {
                path: 'review',
                lazy: async () => ({
                  Component: (await import('../features/review-desk/routes/review-desk-route'))
                    .ReviewDeskRoute,
                }),
              },
            ],
          },
          {
            element: (
              <RequireRole screen="Access" roles={['reader', 'integrator', 'curator', 'admin']} />
            ),
            children: [
              {
                path: 'access',
                lazy: async () => ({
                  Component: (await import('../features/access/routes/access-route')).AccessRoute,
                }),
              },
            ],
          },
          {
            element: <RequireRole screen="Administration" roles={['admin']} />,
            children: [ADMIN],
          },
          { path: '*', element: <NotFoundPage /> },
        ],
      },
    ],
  },
]);
