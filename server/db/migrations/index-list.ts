import { Foundation1764633600000 } from './1764633600000-Foundation';
import { Enrolment1764720000000 } from './1764720000000-Enrolment';
import { Recordings1764806400000 } from './1764806400000-Recordings';
import { Monitoring1764892800000 } from './1764892800000-Monitoring';
import { Visits1764979200000 } from './1764979200000-Visits';
import { Reminders1765065600000 } from './1765065600000-Reminders';
import { Journeys1765152000000 } from './1765152000000-Journeys';
import { StudyJudgement1765238400000 } from './1765238400000-StudyJudgement';
import { MessageOutcomeUnknown1765324800000 } from './1765324800000-MessageOutcomeUnknown';
import { AccountSetupAndReadingVersions1765411200000 } from './1765411200000-AccountSetupAndReadingVersions';
import { RecordingColumnMappings1765497600000 } from './1765497600000-RecordingColumnMappings';
import { PhoneNumbersE1641765584000000 } from './1765584000000-PhoneNumbersE164';
import { OverviewIndexes1765670400000 } from './1765670400000-OverviewIndexes';
import { ListIndexes1765929600000 } from './1765929600000-ListIndexes';
import { MessageAndPeopleListIndexes1766016000000 } from './1766016000000-MessageAndPeopleListIndexes';
import { AuditReadsAndChain1766102400000 } from './1766102400000-AuditReadsAndChain';
import { DischargeChecklist1766188800000 } from './1766188800000-DischargeChecklist';
import { EquipmentOrders1766275200000 } from './1766275200000-EquipmentOrders';
import { ReminderProgrammeMatchesInfant1766361600000 } from './1766361600000-ReminderProgrammeMatchesInfant';
import { InfantNameSearchIndex1766448000000 } from './1766448000000-InfantNameSearchIndex';
import { MessageSearchIndexes1766534400000 } from './1766534400000-MessageSearchIndexes';

export const MIGRATIONS = [
  Foundation1764633600000, Enrolment1764720000000, Recordings1764806400000, Monitoring1764892800000, Visits1764979200000, Reminders1765065600000,
  Journeys1765152000000, StudyJudgement1765238400000, MessageOutcomeUnknown1765324800000, AccountSetupAndReadingVersions1765411200000,
  RecordingColumnMappings1765497600000,
  PhoneNumbersE1641765584000000,
  OverviewIndexes1765670400000,
  ListIndexes1765929600000,
  MessageAndPeopleListIndexes1766016000000,
  AuditReadsAndChain1766102400000,
  DischargeChecklist1766188800000,
  EquipmentOrders1766275200000,
  ReminderProgrammeMatchesInfant1766361600000,
  InfantNameSearchIndex1766448000000,
  MessageSearchIndexes1766534400000,
];
