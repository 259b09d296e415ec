import { InitialSchema1796163989801 } from './1796163989801-InitialSchema';

// Migrations in the order they run; a new migration file is listed here too.
export const MIGRATIONS: Function[] = [InitialSchema1796163989801];
