import { accountsApi } from '../modules/accounts/accounts.api';
import { auditApi } from '../modules/audit/audit.api';
import { carePlanApi } from '../modules/care-plan/care-plan.api';
import { conversionsApi } from '../modules/conversions/conversions.api';
import { dischargeApi } from '../modules/discharge/discharge.api';
import { equipmentOrdersApi } from '../modules/equipment-orders/equipment-orders.api';
import { fhirApi } from '../modules/fhir/fhir.api';
import { healthApi } from '../modules/health/health.api';
import { infantsApi } from '../modules/infants/infants.api';
import { journeysApi } from '../modules/journeys/journeys.api';
import { messagesApi } from '../modules/messages/messages.api';
import { overviewApi } from '../modules/overview/overview.api';
import { policyApi } from '../modules/policy/policy.api';
import { preferencesApi } from '../modules/preferences/preferences.api';
import { prescriptionsApi } from '../modules/prescriptions/prescriptions.api';
import { readingsApi } from '../modules/readings/readings.api';
import { recordingsApi } from '../modules/recordings/recordings.api';
import { scheduleApi } from '../modules/schedule/schedule.api';
import { sessionApi } from '../modules/session/session.api';
import { sitesApi } from '../modules/sites/sites.api';
import { smsInboundApi } from '../modules/sms-inbound/sms-inbound.api';
import { stepDownsApi } from '../modules/step-downs/step-downs.api';
import { usersApi } from '../modules/users/users.api';
import { visitsApi } from '../modules/visits/visits.api';
import { openapiApi } from './openapi.router';
import type { ApiRoute } from './api-route';

/**
 * Every route the API serves, for its OpenAPI description. Each module declares its routes in `<feature>.api.ts`
 * beside its router; a new route is one `route(...)` line there (tests/api/openapi.test.ts fails on a mounted route
 * missing here, or one whose contracts differ from those its router validates with).
 */
export const API_ROUTES: ApiRoute[] = [
  ...healthApi, ...openapiApi, ...smsInboundApi, ...sessionApi, ...accountsApi, ...usersApi, ...sitesApi, ...policyApi, ...conversionsApi,
  ...infantsApi, ...carePlanApi, ...readingsApi, ...scheduleApi, ...stepDownsApi, ...visitsApi, ...prescriptionsApi, ...messagesApi,
  ...preferencesApi, ...recordingsApi, ...journeysApi, ...overviewApi,
  ...fhirApi, ...dischargeApi, ...auditApi, ...equipmentOrdersApi,
];
