import { CreatePlans1764626400000 } from './1764626400000-create-plans';
import { CreateAccounts1764630000001 } from './1764630000001-create-accounts';
import { CreatePlanDocuments1764640000000 } from './1764640000000-create-plan-documents';

/**
 * Every migration, oldest first. Listed explicitly (no glob) so jest, tsx and the TypeORM CLI
 * load exactly the same set. New migrations are appended here.
 */
export const migrations = [
  CreatePlans1764626400000,
  CreateAccounts1764630000001,
  CreatePlanDocuments1764640000000,
];
