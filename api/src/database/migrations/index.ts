import type { MigrationInterface } from 'typeorm';
import { InitialSchema1796163989801 } from './1796163989801-InitialSchema';
import { ApiTokens1796182651904 } from './1796182651904-ApiTokens';
import { ScanModelSetNull1796193248504 } from './1796193248504-ScanModelSetNull';
import { Uploads1796300000001 } from './1796300000001-Uploads';
import { Maintenance1796300000002 } from './1796300000002-Maintenance';
import { Invitations1796300000003 } from './1796300000003-Invitations';
import { CommentsAndNotifications1796300000004 } from './1796300000004-CommentsAndNotifications';
import { AuditActionNames1796300000005 } from './1796300000005-AuditActionNames';
import { AccountControls1796300000010 } from './1796300000010-AccountControls';
import { LeanPointIndexes1796300000021 } from './1796300000021-LeanPointIndexes';
import { LikelihoodSets1796300000030 } from './1796300000030-LikelihoodSets';
import { PointAxisColumns1796300000020 } from './1796300000020-PointAxisColumns';
import { ScanProvenance1796300000040 } from './1796300000040-ScanProvenance';
import { ScanReproductions1796300000041 } from './1796300000041-ScanReproductions';
import { ScanRefinement1796300000050 } from './1796300000050-ScanRefinement';

// Migrations in the order they run; a new migration file is listed here too.
export const MIGRATIONS: (new () => MigrationInterface)[] = [
  InitialSchema1796163989801, ApiTokens1796182651904, ScanModelSetNull1796193248504, Uploads1796300000001,
  Maintenance1796300000002, Invitations1796300000003, CommentsAndNotifications1796300000004,
  AuditActionNames1796300000005, AccountControls1796300000010, PointAxisColumns1796300000020,
  LeanPointIndexes1796300000021, LikelihoodSets1796300000030, ScanProvenance1796300000040,
  ScanReproductions1796300000041, ScanRefinement1796300000050,
];
