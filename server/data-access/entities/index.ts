import { InvitationEntity } from './invitation.entity';
import { MembershipEntity } from './membership.entity';
import { PasswordResetTokenEntity } from './password-reset-token.entity';
import { PlanEntity } from './plan.entity';
import { PlanDocStateEntity } from './plan-doc-state.entity';
import { PlanDocUpdateEntity } from './plan-doc-update.entity';
import { PlanSnapshotEntity } from './plan-snapshot.entity';
import { PlanRoleOverrideEntity } from './plan-role-override.entity';
import { TeamEntity } from './team.entity';
import { UserEntity } from './user.entity';

/** Every entity the data source knows. Entities never leave `data-access/`. */
export const entities = [
  PlanEntity,
  UserEntity,
  TeamEntity,
  MembershipEntity,
  InvitationEntity,
  PasswordResetTokenEntity,
  PlanRoleOverrideEntity,
  PlanDocStateEntity,
  PlanDocUpdateEntity,
  PlanSnapshotEntity,
];
