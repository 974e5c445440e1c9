// Data source for the TypeORM CLI (`npm run migration:run`, `migration:generate`).
import { loadConfig } from '../config';
import { createDataSource } from './data-source';

export default createDataSource(loadConfig().DATABASE_URL);
