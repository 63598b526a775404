import { AuditEventEntity } from './audit-event.entity';
import { FamilyContactEntity } from './family-contact.entity';
import { InfantEntity } from './infant.entity';
import { PrescriptionEntity } from './prescription.entity';
import { ProgrammePolicyEntity } from './programme-policy.entity';
import { ProgrammeEntity } from './programme.entity';
import { SiteEntity } from './site.entity';
import { UserEntity } from './user.entity';
import { CheckEntity } from './check.entity';
import { ReadingEntity } from './reading.entity';
import { VisitEntity } from './visit.entity';
import { RecordingEntity } from './recording.entity';
import { RecordingSamplesEntity } from './recording-samples.entity';
import { JourneyEntity } from './journey.entity';
import { AccountSetupTokenEntity } from './account-setup-token.entity';
import { DischargeEntity, DischargeItemEntity } from './discharge.entity';
import { EquipmentOrderEntity } from './equipment-order.entity';

// Listed explicitly (no glob) so tsx, Vitest and the TypeORM CLI load the same set.
export const ENTITIES = [
  ProgrammeEntity, UserEntity, AuditEventEntity, SiteEntity, ProgrammePolicyEntity, InfantEntity, FamilyContactEntity, PrescriptionEntity,
  CheckEntity, ReadingEntity, VisitEntity, RecordingEntity, RecordingSamplesEntity, JourneyEntity, AccountSetupTokenEntity,
  DischargeItemEntity, DischargeEntity,
  EquipmentOrderEntity,
];
