import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, redirect, type LoaderFunctionArgs, type RouteObject } from 'react-router';
import { Loading } from '../components/ui/loading';
import { meQueryOptions } from '../hooks/use-me';
import { officeQueryOptions } from '../hooks/use-office';
import type { Role } from '../../shared/contracts/common';
import { adminRoles, authoringRoles, intakeViewerRoles, officeReaderRoles, hasRole, reviewingRoles, subscriberOverseerRoles, subscriberRoles, webhookManagerRoles } from '../../shared/workflow/roles';
import { homePathFor } from '../utils/roles';
import { NotFoundPage } from './not-found';
import { RouteErrorPage } from './route-error';

type PageLoader = () => Promise<unknown>;

/**
 * Warms a page's queries only when the signed-in role may open it, so a refused visit does not
 * fire requests the server would refuse anyway. The page itself shows the refusal (RoleGate).
 */
function loaderForRoles(queryClient: QueryClient, roles: readonly Role[], load?: PageLoader) {
  return async () => {
    const me = await queryClient.ensureQueryData(meQueryOptions());
    if (me && hasRole(me.user.role, roles) && load) await load();
    return null;
  };
}

/** The role check of a group of staff pages, loaded with them (the public pages never need it). */
function roleGate(roles: readonly Role[]) {
  return async () => {
    const { RoleGate } = await import('./layouts/role-gate');
    return { element: <RoleGate roles={roles} /> };
  };
}

function InitialLoading() {
  return (
    <div className="flex min-h-dvh items-center justify-center">
      <Loading label="Opening Stormdraft…" />
    </div>
  );
}


/** Every page, lazy-loaded so the public bulletin never downloads staff pages. */
export function createRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: '/',
      errorElement: <RouteErrorPage />,
      HydrateFallback: InitialLoading,
      children: [
        {
          index: true,
          Component: InitialLoading,
          loader: async () => {
            const me = await queryClient.ensureQueryData(meQueryOptions());
            return redirect(me ? homePathFor(me.user.role) : '/bulletin');
          },
        },
        {
          lazy: async () => ({ Component: (await import('./layouts/public-layout')).PublicLayout }),
          loader: () => {
            void queryClient.prefetchQuery(officeQueryOptions());
            void queryClient.prefetchQuery(meQueryOptions());
            return null;
          },
          children: [
            {
              path: 'bulletin',
              lazy: async () => {
                const page = await import('../features/bulletin/routes/bulletin');
                return { Component: page.BulletinPage, loader: page.bulletinLoader(queryClient) };
              },
            },
            {
              path: 'archive',
              lazy: async () => {
                const page = await import('../features/bulletin/routes/archive');
                return { Component: page.ArchivePage, loader: page.archiveLoader(queryClient) };
              },
            },
            {
              path: 'issuances/:issuanceNumber',
              lazy: async () => {
                const page = await import('../features/bulletin/routes/issuance');
                return { Component: page.IssuancePage, loader: page.issuanceLoader(queryClient) };
              },
            },
            {
              path: 'sign-in',
              loader: async () => {
                const me = await queryClient.ensureQueryData(meQueryOptions());
                return me ? redirect(homePathFor(me.user.role)) : null;
              },
              lazy: async () => ({ Component: (await import('../features/auth/routes/sign-in')).SignInPage }),
            },
            { path: 'register', lazy: async () => ({ Component: (await import('../features/auth/routes/register')).RegisterPage }) },
            {
              path: 'forgot-password',
              lazy: async () => ({ Component: (await import('../features/auth/routes/forgot-password')).ForgotPasswordPage }),
            },
            {
              path: 'reset-password',
              lazy: async () => ({ Component: (await import('../features/auth/routes/reset-password')).ResetPasswordPage }),
            },
          ],
        },
        {
          lazy: async () => ({ Component: (await import('./layouts/app-layout')).AppLayout }),
          loader: async ({ request }: LoaderFunctionArgs) => {
            void queryClient.prefetchQuery(officeQueryOptions());
            const me = await queryClient.ensureQueryData(meQueryOptions());
            if (me === null) {
              const url = new URL(request.url);
              return redirect(`/sign-in?next=${encodeURIComponent(`${url.pathname}${url.search}`)}`);
            }
            return null;
          },
          children: [
            {
              lazy: roleGate(authoringRoles),
              children: [
                {
                  path: 'desk',
                  loader: loaderForRoles(queryClient, authoringRoles),
                  lazy: async () => ({ Component: (await import('../features/outlooks/routes/desk')).DeskPage }),
                },
              ],
            },
            {
              lazy: roleGate(officeReaderRoles),
              children: [
                {
                  path: 'outlooks/:outlookId',
                  lazy: async () => {
                    const page = await import('../features/outlooks/routes/workspace');
                    return { Component: page.OutlookWorkspacePage, loader: (args: LoaderFunctionArgs) => loaderForRoles(queryClient, officeReaderRoles, () => page.workspaceLoader(queryClient)(args))() };
                  },
                },
                {
                  path: 'outlooks/:outlookId/revisions/:revisionId',
                  loader: loaderForRoles(queryClient, officeReaderRoles),
                  lazy: async () => ({ Component: (await import('../features/outlooks/routes/revision')).OutlookRevisionPage }),
                },
              ],
            },
            {
              lazy: roleGate(authoringRoles),
              children: [
                {
                  path: 'soundings/upload',
                  loader: loaderForRoles(queryClient, authoringRoles),
                  lazy: async () => ({ Component: (await import('../features/soundings/routes/upload')).SoundingUploadPage }),
                },
              ],
            },
            {
              lazy: roleGate(officeReaderRoles),
              children: [
                {
                  path: 'verification',
                  lazy: async () => {
                    const page = await import('../features/verification/routes/verification');
                    return { Component: page.VerificationPage, loader: loaderForRoles(queryClient, officeReaderRoles, page.verificationLoader(queryClient)) };
                  },
                },
              ],
            },
            {
              lazy: roleGate(officeReaderRoles),
              children: [
                {
                  path: 'soundings',
                  lazy: async () => {
                    const page = await import('../features/soundings/routes/library');
                    return { Component: page.SoundingLibraryPage, loader: (args: LoaderFunctionArgs) => loaderForRoles(queryClient, officeReaderRoles, () => page.soundingLibraryLoader(queryClient)(args))() };
                  },
                },
                {
                  path: 'soundings/map',
                  loader: loaderForRoles(queryClient, officeReaderRoles),
                  lazy: async () => ({ Component: (await import('../features/soundings/routes/map')).SoundingMapPage }),
                },
                {
                  path: 'soundings/grid/:gridSoundingId',
                  lazy: async () => {
                    const page = await import('../features/soundings/routes/grid-sounding');
                    return { Component: page.GridSoundingPage, loader: (args: LoaderFunctionArgs) => loaderForRoles(queryClient, officeReaderRoles, () => page.gridSoundingLoader(queryClient)(args))() };
                  },
                },
                {
                  path: 'soundings/:soundingId',
                  lazy: async () => {
                    const page = await import('../features/soundings/routes/sounding');
                    return { Component: page.SoundingPage, loader: (args: LoaderFunctionArgs) => loaderForRoles(queryClient, officeReaderRoles, () => page.soundingLoader(queryClient)(args))() };
                  },
                },
              ],
            },
            {
              lazy: roleGate(reviewingRoles),
              children: [
                {
                  path: 'review',
                  lazy: async () => {
                    const page = await import('../features/review/routes/review-queue');
                    return { Component: page.ReviewQueuePage, loader: loaderForRoles(queryClient, reviewingRoles, page.reviewQueueLoader(queryClient)) };
                  },
                },
              ],
            },
            {
              lazy: roleGate(authoringRoles),
              children: [
                {
                  path: 'review/:outlookId',
                  lazy: async () => {
                    const page = await import('../features/review/routes/review');
                    return { Component: page.ReviewPage, loader: (args: LoaderFunctionArgs) => loaderForRoles(queryClient, authoringRoles, () => page.reviewLoader(queryClient)(args))() };
                  },
                },
              ],
            },
            {
              lazy: roleGate(subscriberRoles),
              children: [
                {
                  path: 'alerts',
                  lazy: async () => {
                    const page = await import('../features/subscriptions/routes/my-alerts');
                    return { Component: page.MyAlertsPage, loader: loaderForRoles(queryClient, subscriberRoles, page.myAlertsLoader(queryClient)) };
                  },
                },
              ],
            },
            {
              lazy: roleGate(webhookManagerRoles),
              children: [
                {
                  path: 'webhooks',
                  lazy: async () => {
                    const page = await import('../features/webhooks/routes/webhooks');
                    return { Component: page.WebhooksPage, loader: loaderForRoles(queryClient, webhookManagerRoles, page.webhooksLoader(queryClient)) };
                  },
                },
              ],
            },
            {
              lazy: roleGate(intakeViewerRoles),
              children: [
                {
                  path: 'intake',
                  lazy: async () => {
                    const page = await import('../features/intake/routes/intake');
                    return { Component: page.IntakePage, loader: loaderForRoles(queryClient, intakeViewerRoles, page.intakeLoader(queryClient)) };
                  },
                },
              ],
            },
            {
              lazy: roleGate(subscriberOverseerRoles),
              children: [
                {
                  path: 'subscribers',
                  lazy: async () => {
                    const page = await import('../features/subscriptions/routes/subscribers');
                    return { Component: page.SubscribersPage, loader: loaderForRoles(queryClient, subscriberOverseerRoles, page.subscribersLoader(queryClient)) };
                  },
                },
              ],
            },
            {
              path: 'admin',
              lazy: roleGate(adminRoles),
              children: [
                { index: true, Component: InitialLoading, loader: () => redirect('/admin/users') },
                {
                  path: 'users',
                  lazy: async () => {
                    const page = await import('../features/admin/routes/users');
                    return { Component: page.UsersPage, loader: loaderForRoles(queryClient, adminRoles, page.usersLoader(queryClient)) };
                  },
                },
                {
                  path: 'settings',
                  lazy: async () => {
                    const page = await import('../features/admin/routes/office-settings');
                    return {
                      Component: page.OfficeSettingsPage,
                      loader: loaderForRoles(queryClient, adminRoles, page.officeSettingsLoader(queryClient)),
                    };
                  },
                },
                {
                  path: 'outbox',
                  lazy: async () => {
                    const page = await import('../features/admin/routes/outbox');
                    return { Component: page.OutboxPage, loader: loaderForRoles(queryClient, adminRoles, page.outboxLoader(queryClient)) };
                  },
                },
                {
                  path: 'mail',
                  lazy: async () => {
                    const page = await import('../features/admin/routes/mail');
                    return { Component: page.MailPage, loader: loaderForRoles(queryClient, adminRoles, page.mailLoader(queryClient)) };
                  },
                },
              ],
            },
            { path: 'account', lazy: async () => ({ Component: (await import('../features/account/routes/account')).AccountPage }) },
          ],
        },
        { path: '*', Component: NotFoundPage },
      ],
    },
  ];
}

export function createAppRouter(queryClient: QueryClient) {
  return createBrowserRouter(createRoutes(queryClient));
}
