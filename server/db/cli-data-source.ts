// The DataSource the TypeORM CLI loads (`npm run migration:run` / `migration:revert`).
import { createDataSource } from './data-source';

export default createDataSource();
