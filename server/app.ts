import express, { type Express } from 'express';
import helmet from 'helmet';
import path from 'node:path';
import fs from 'node:fs';
import compression from 'compression';
import expressStaticGzip from 'express-static-gzip';
import { defineAbilityFor } from '@shared/auth/ability';
import type { AppDeps } from './deps';
import { createPassport } from './auth/passport';
import { createCsrf } from './auth/csrf';
import { absoluteTimeout, createSessionMiddleware, SESSION_COOKIE } from './auth/session-middleware';
import { createSignInLimiter } from './auth/sign-in-limiter';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { requestLog } from './middleware/request-log';
import { spaPages } from './web/spa-page';
import { healthRouter } from './modules/health/health.router';
import { createSessionService } from './modules/session/session.service';
import { sessionRouter } from './modules/session/session.router';
import { createUsersService } from './modules/users/users.service';
import { createAccountsService } from './modules/accounts/accounts.service';
import { myPasswordRouter, setupLinkRouter } from './modules/accounts/accounts.router';
import { createAccountMail } from './notifications/account-mail';
import { usersRouter } from './modules/users/users.router';
import { sitesRouter } from './modules/sites/sites.router';
import { policyRouter } from './modules/policy/policy.router';
import { createPolicyService } from './modules/policy/policy.service';
import { conversionsRouter } from './modules/conversions/conversions.router';
import { createInfantsService } from './modules/infants/infants.service';
import { infantsRouter } from './modules/infants/infants.router';
import { caseloadCsvRouter } from './modules/infants/caseload-csv';
import { createPrescriptionsService } from './modules/prescriptions/prescriptions.service';
import { prescriptionsRouter } from './modules/prescriptions/prescriptions.router';
import { createScheduleService } from './modules/schedule/schedule.service';
import { scheduleRouters } from './modules/schedule/schedule.router';
import { createReadingsService } from './modules/readings/readings.service';
import { readingsRouters } from './modules/readings/readings.router';
import { createStepDownsService } from './modules/step-downs/step-downs.service';
import { stepDownsRouter } from './modules/step-downs/step-downs.router';
import { createVisitsService } from './modules/visits/visits.service';
import { smsInboundRouter } from './modules/sms-inbound/sms-inbound.router';
import { messagesRouter } from './modules/messages/messages.router';
import { messagesCsvRouter } from './modules/messages/messages-csv';
import { createMessagesService } from './modules/messages/messages.service';
import { preferencesRouter } from './modules/preferences/preferences.router';
import { createPreferencesService } from './modules/preferences/preferences.service';
import { visitsRouters } from './modules/visits/visits.router';
import { createRecordingsService } from './modules/recordings/recordings.service';
import { infantRecordingsRouter, recordingsRouter } from './modules/recordings/recordings.router';
import { createJourneysService } from './modules/journeys/journeys.service';
import { journeysRouters } from './modules/journeys/journeys.router';
import { createCarePlanService } from './modules/care-plan/care-plan.service';
import { carePlanRouter } from './modules/care-plan/care-plan.router';
import { fhirRouter } from './modules/fhir/fhir.router';
import { createFhirService } from './modules/fhir/fhir.service';
import { overviewRouter } from './modules/overview/overview.router';
import { createOverviewService } from './modules/overview/overview.service';
import { openapiRouter } from './openapi/openapi.router';
import { API_ROUTES } from './openapi/api-routes';

/** The version of the API description; raise it when a contract changes incompatibly. */
const OPENAPI_VERSION = '1.0.0';
import { readAuditMiddleware } from './modules/audit/read-audit';
import { auditRouters } from './modules/audit/audit.router';
import { createAuditChainService } from './modules/audit/chain.service';
import { createReadsService } from './modules/audit/reads.service';
import { createAuditChainMail } from './notifications/audit-chain-mail';
import { dischargeRouter } from './modules/discharge/discharge.router';
import { createDischargeService } from './modules/discharge/discharge.service';
import { createDischargeLetterService } from './modules/discharge/discharge-letter.service';
import { createEquipmentOrdersService } from './modules/equipment-orders/equipment-orders.service';
import { equipmentOrdersRouters, supplierRouter } from './modules/equipment-orders/equipment-orders.router';
import { createSupplierService } from './modules/equipment-orders/supplier.service';

/** Builds the HTTP app; never listens (main.ts does, tests use Supertest). */
export function createApp(deps: AppDeps): Express {
  const { env, repos, logger } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', env.TRUST_PROXY ? 1 : false);
  app.use(requestLog(logger));
  // gzip for the web bundle and JSON (a phone on a slow line downloads about a third of the bytes); PDFs and
  // other already-compressed types are left as they are by the filter's defaults.
  app.use(compression());
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          baseUri: ["'none'"],
          frameAncestors: ["'none'"],
          objectSrc: ["'none'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'"],
          imgSrc: ["'self'", 'data:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          formAction: ["'self'"],
          upgradeInsecureRequests: env.COOKIE_SECURE ? [] : null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );

  const limiter = createSignInLimiter(deps.redis, {
    pairLimit: env.SIGNIN_PAIR_LIMIT,
    ipLimit: env.SIGNIN_IP_LIMIT,
    windowSeconds: env.SIGNIN_WINDOW_SECONDS,
    accountLimit: env.SIGNIN_ACCOUNT_LIMIT,
    accountWindowSeconds: env.SIGNIN_ACCOUNT_WINDOW_SECONDS,
    keyPrefix: env.QUEUE_PREFIX,
  });
  const accountMail = createAccountMail(deps.mail);
  const now = deps.now ?? (() => new Date());
  const sessions = createSessionService({ users: repos.users, audit: repos.audit, limiter, mail: accountMail, logger, alertAfterFailures: env.SIGNIN_PAIR_LIMIT });
  const accounts = createAccountsService({ ds: deps.ds, repos, limiter, now });
  const passport = createPassport(sessions);
  const csrf = createCsrf(env.SESSION_SECRET, env.COOKIE_SECURE);

  const api = express.Router();
  api.use('/health', healthRouter({ ds: deps.ds, redis: deps.redis, queuePrefix: env.QUEUE_PREFIX, clock: deps.clock }));
  // The API description holds no records, so it needs no session (server/openapi/).
  api.use('/openapi.json', openapiRouter(() => API_ROUTES, OPENAPI_VERSION));
  // Provider callbacks carry a signature instead of a session or a CSRF token.
  api.use('/webhooks/sms', smsInboundRouter({ ds: deps.ds, repos, logger: deps.logger, authToken: env.TWILIO_AUTH_TOKEN, webhookUrl: env.INBOUND_WEBHOOK_URL }));
  api.use(express.json({ limit: '200kb' }));
  api.use(createSessionMiddleware(env, deps.sessionPool));
  api.use(passport.session());
  api.use(absoluteTimeout(env.SESSION_ABSOLUTE_HOURS));
  api.use(async (req, _res, next) => {
    const u = req.user;
    // A family account's rules name its own babies; staff rules need nothing beyond the session.
    const infantIds = u?.role === 'family' ? await repos.contacts.infantIdsForUser(u.id) : [];
    req.ability = defineAbilityFor(u ? { id: u.id, role: u.role, programmeId: u.programmeId, infantIds } : null);
    next();
  });
  api.use(readAuditMiddleware(repos.audit));
  api.use(csrf.csrfSynchronisedProtection);
  api.use('/session', sessionRouter(passport, csrf, sessions));
  api.use('/account/set-password', setupLinkRouter(accounts));
  api.use('/me/password', myPasswordRouter(accounts));
  api.use('/users', usersRouter(createUsersService({ ds: deps.ds, repos, mail: accountMail, publicUrl: env.PUBLIC_URL, setupLinkHours: env.SETUP_LINK_HOURS, now })));
  const prescriptions = createPrescriptionsService(deps.ds, repos, deps.jobs, deps.clock);
  const infants = createInfantsService(deps.ds, repos, deps.jobs);
  const schedule = scheduleRouters(createScheduleService(repos), deps.clock);
  const readings = readingsRouters(createReadingsService(deps.ds, repos, deps.jobs));
  api.use('/sites', sitesRouter(repos.sites));
  api.use('/policy', policyRouter(createPolicyService(deps.ds, repos, deps.jobs)));
  api.use('/conversions', conversionsRouter(repos.policies));
  api.use('/infants.csv', caseloadCsvRouter(infants));
  api.use('/infants', infantsRouter(infants, prescriptions));
  api.use('/infants', schedule.infants, readings.infants, stepDownsRouter(createStepDownsService(deps.ds, repos), deps.clock));
  const visits = visitsRouters(createVisitsService(deps.ds, repos, deps.jobs, deps.clock));
  api.use('/infants', visits.infants);
  api.use('/visits', visits.visits);
  api.use('/my-day', schedule.day);
  api.use('/readings', readings.readings);
  api.use('/prescriptions', prescriptionsRouter(prescriptions));
  const messages = createMessagesService(deps.ds, repos, deps.jobs);
  api.use('/messages.csv', messagesCsvRouter(messages));
  api.use('/messages', messagesRouter(messages));
  api.use('/me/preferences', preferencesRouter(createPreferencesService(deps.ds, repos)));
  const recordings = createRecordingsService(deps.ds, repos, deps.jobs);
  api.use('/infants', infantRecordingsRouter(recordings));
  api.use('/recordings', recordingsRouter(recordings));
  const journeys = journeysRouters(createJourneysService(deps.ds, repos));
  api.use('/infants', journeys.infants, carePlanRouter(createCarePlanService(repos)));
  api.use('/infants', fhirRouter(createFhirService(repos, { systemBase: env.PUBLIC_URL }), deps.clock));
  api.use('/journeys', journeys.journeys);
  api.use('/infants', dischargeRouter(createDischargeService(deps.ds, repos, deps.clock), createDischargeLetterService(repos, deps.mail, deps.clock)));
  api.use('/overview', overviewRouter(createOverviewService(repos), deps.clock));
  const audit = auditRouters(createAuditChainService(repos, logger, now, { mail: createAuditChainMail(deps.mail) }), createReadsService(repos));
  api.use('/audit', audit.audit);
  api.use('/infants', audit.infants);
  // Equipment orders to the supplier (issue 16).
  const supplierLinks = { publicUrl: env.PUBLIC_URL, secret: env.SUPPLIER_LINK_SECRET, days: env.SUPPLIER_LINK_DAYS };
  const orders = equipmentOrdersRouters(createEquipmentOrdersService({ ds: deps.ds, repos, mail: deps.mail, link: supplierLinks, logger, clock: deps.clock }));
  api.use('/infants', orders.infants);
  api.use('/equipment-orders', orders.orders);
  api.use(apiNotFound);
  app.use('/api', api);
  // The supplier's side of an order: outside /api and its sessions; the signed link is the credential.
  app.use('/supplier-api', supplierRouter(createSupplierService(deps.ds, repos, env.SUPPLIER_LINK_SECRET, deps.clock)));

  const webDist = path.resolve(env.WEB_DIST);
  if (fs.existsSync(path.join(webDist, 'index.html'))) {
    // Bundle files carry a hash of their content in the name, so a browser may keep them for good; a new release
    // names new files. Everything else (the page itself, the icon) is checked again.
    // The build writes each bundle file also brotli- and gzip-compressed (vite.config.ts); the best the browser
    // takes is sent as it is, and compression() below leaves an encoded answer alone.
    app.use(
      '/assets',
      expressStaticGzip(path.join(webDist, 'assets'), {
        enableBrotli: true,
        orderPreference: ['br', 'gzip'],
        index: false,
        serveStatic: { maxAge: '1y', immutable: true },
      }),
    );
    app.use(express.static(webDist, { index: false, maxAge: '1h' }));
    // A bundle file this build does not have (an old page asking for last release's chunk) is a 404, not the
    // app's page with status 200 that the browser would then try to run as a script.
    app.use('/assets', (_req, res) => {
      res.status(404).type('text/plain').send('Not found');
    });
    const pageFor = spaPages(webDist);
    app.get('/{*splat}', (req, res) => {
      res.set('Cache-Control', 'no-cache');
      // A session cookie (not yet checked: the page's own requests are) lets the page name its first data request.
      const signedIn = typeof req.headers.cookie === 'string' && req.headers.cookie.includes(`${SESSION_COOKIE}=`);
      res.type('html').send(pageFor(req.path, new URL(req.originalUrl, 'http://page').searchParams, signedIn));
    });
  }
  app.use(errorHandler(logger));
  return app;
}
