import type { DataSource } from 'typeorm';

import type { Config } from '../config';
import { InvitationRepository } from '../data-access/repositories/invitation-repository';
import { MembershipRepository } from '../data-access/repositories/membership-repository';
import { PasswordResetRepository } from '../data-access/repositories/password-reset-repository';
import { PlanRepository } from '../data-access/repositories/plan-repository';
import { SessionRepository } from '../data-access/repositories/session-repository';
import { TeamRepository } from '../data-access/repositories/team-repository';
import { UserRepository } from '../data-access/repositories/user-repository';
import type { Mailer } from '../mail/mailer';
import type { AccessEvents } from './access-events';
import { AccessService } from './access-service';
import { AccountService } from './account-service';
import { InvitationService } from './invitation-service';
import { PlanService } from './plan-service';
import { SignInThrottle } from './sign-in-throttle';
import { TeamService } from './team-service';

/** Repositories and use cases of accounts, teams and plans, built fresh per application. */
export interface AccountsContext {
  users: UserRepository;
  teamRecords: TeamRepository;
  access: AccessService;
  accounts: AccountService;
  teams: TeamService;
  invitations: InvitationService;
  plans: PlanService;
}

export function createAccountsContext(deps: {
  config: Config;
  dataSource: DataSource;
  mailer: Mailer;
  events: AccessEvents;
}): AccountsContext {
  const { config, dataSource: ds, mailer, events } = deps;
  const users = new UserRepository(ds);
  const teamRecords = new TeamRepository(ds);
  const memberships = new MembershipRepository(ds);
  const planRecords = new PlanRepository(ds);
  const access = new AccessService(memberships, planRecords);
  const throttle = new SignInThrottle({
    freeFailures: config.SIGN_IN_FREE_FAILURES,
    baseDelayMs: config.SIGN_IN_DELAY_BASE_MS,
    maxDelayMs: config.SIGN_IN_DELAY_MAX_MS,
  });
  const accounts = new AccountService({
    users,
    resets: new PasswordResetRepository(ds),
    sessions: new SessionRepository(ds),
    mailer,
    events,
    throttle,
    bcryptCost: config.BCRYPT_COST,
    resetTtlMinutes: config.PASSWORD_RESET_TTL_MINUTES,
  });
  const invitations = new InvitationService({
    invitations: new InvitationRepository(ds),
    memberships,
    teams: teamRecords,
    users,
    access,
    events,
    mailer,
    ttlHours: config.INVITATION_TTL_HOURS,
  });
  return {
    users,
    teamRecords,
    access,
    accounts,
    teams: new TeamService(teamRecords, memberships, access, events),
    invitations,
    plans: new PlanService(planRecords, memberships, access, events),
  };
}
