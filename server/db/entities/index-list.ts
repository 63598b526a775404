import { AuditEventEntity } from './audit-event.entity';
import { ProgrammeEntity } from './programme.entity';
import { UserEntity } from './user.entity';

// Listed explicitly (no glob) so tsx, Vitest and the TypeORM CLI load the same set.
export const ENTITIES = [ProgrammeEntity, UserEntity, AuditEventEntity];
