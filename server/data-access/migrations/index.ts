import { CreatePlans1764626400000 } from './1764626400000-create-plans';

/**
 * Every migration, oldest first. Listed explicitly (no glob) so jest, tsx and the TypeORM CLI
 * load exactly the same set. New migrations are appended here.
 */
export const migrations = [CreatePlans1764626400000];
