import { Routes } from '@angular/router';

import { signedInGuard, signedOutGuard, teamRoleGuard } from './shared/auth/auth-guards';

export const routes: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Rampart',
    loadComponent: () => import('./pages/home/home').then((m) => m.Home),
  },
  {
    path: 'sign-in',
    title: 'Sign in · Rampart',
    canActivate: [signedOutGuard],
    loadComponent: () => import('./pages/sign-in/sign-in').then((m) => m.SignIn),
  },
  {
    path: 'register',
    title: 'Create an account · Rampart',
    canActivate: [signedOutGuard],
    loadComponent: () => import('./pages/register/register').then((m) => m.Register),
  },
  {
    path: 'forgot-password',
    title: 'Forgot password · Rampart',
    loadComponent: () =>
      import('./pages/forgot-password/forgot-password').then((m) => m.ForgotPassword),
  },
  {
    // The mailed link is /reset-password/<token>; ?token= is accepted too.
    path: 'reset-password/:token',
    title: 'New password · Rampart',
    loadComponent: () =>
      import('./pages/reset-password/reset-password').then((m) => m.ResetPassword),
  },
  {
    path: 'reset-password',
    title: 'New password · Rampart',
    loadComponent: () =>
      import('./pages/reset-password/reset-password').then((m) => m.ResetPassword),
  },
  {
    // Open to everyone: a signed-out visitor sees the offer first, then signs in and comes back.
    path: 'invitations/:token',
    title: 'Team invitation · Rampart',
    loadComponent: () =>
      import('./pages/accept-invitation/accept-invitation').then((m) => m.AcceptInvitation),
  },
  {
    path: 'account/password',
    title: 'Change password · Rampart',
    canActivate: [signedInGuard],
    loadComponent: () =>
      import('./pages/change-password/change-password').then((m) => m.ChangePassword),
  },
  {
    path: 'teams',
    title: 'Teams · Rampart',
    canActivate: [signedInGuard],
    loadComponent: () => import('./pages/teams/teams').then((m) => m.Teams),
  },
  {
    // Every member role may open the team page; what it shows follows the role.
    path: 'teams/:teamId',
    title: 'Team · Rampart',
    canActivate: [teamRoleGuard],
    loadComponent: () => import('./pages/team/team').then((m) => m.Team),
  },
  {
    // The live plan; the relay decides what the caller may do, the page follows its answer.
    path: 'plans/:planId',
    title: 'Plan · Rampart',
    canActivate: [signedInGuard],
    loadComponent: () => import('./pages/plan/live-plan').then((m) => m.LivePlan),
  },
  { path: '**', redirectTo: '' },
];
