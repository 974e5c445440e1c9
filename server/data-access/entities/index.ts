import { PlanEntity } from './plan.entity';

/** Every entity the data source knows. Entities never leave `data-access/`. */
export const entities = [PlanEntity];
