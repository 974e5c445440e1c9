import { Routes } from '@angular/router';

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
    loadComponent: () => import('./pages/sign-in/sign-in').then((m) => m.SignIn),
  },
  { path: '**', redirectTo: '' },
];
