import express, { type Request } from 'express';
import type pg from 'pg';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import { logSerializers, withoutQueryValues } from './logger.ts';
import { accountRouter } from './account/account.router.ts';
import { auditRouter } from './audit/audit.router.ts';
import { AuditRepository } from './audit/audit.repository.ts';
import { AuditService } from './audit/audit.service.ts';
import { authRouter } from './auth/auth.router.ts';
import { createCsrf } from './auth/csrf.ts';
import { SessionsRepository } from './auth/sessions.repository.ts';
import { DesignsRepository } from './designs/designs.repository.ts';
import { ConstructionEvaluator } from './designs/construction-evaluator.ts';
import { DesignEditsService } from './designs/design-edits.service.ts';
import { DesignMaterials } from './designs/design-materials.ts';
import { DesignsService } from './designs/designs.service.ts';
import { designsRouter } from './designs/designs.router.ts';
import { exportsRouter } from './exports/exports.router.ts';
import { ExportsService } from './exports/exports.service.ts';
import { createPassport } from './auth/passport.ts';
import { absoluteLifetime, createSessionMiddleware, idleRenewal } from './auth/session.ts';
import { createSessionLayer } from './auth/session-layer.ts';
import { calcRouter } from './calc/calc.router.ts';
import { CalcService } from './calc/calc.service.ts';
import { SearchPool } from './calc/search-pool.ts';
import { catalogueRouter } from './catalogue/catalogue.router.ts';
import { CatalogueService } from './catalogue/catalogue.service.ts';
import { CHECK_JOB, CHECK_LIMITS, CHECK_RETRY } from './checks/check-jobs.ts';
import { ChecksRepository } from './checks/checks.repository.ts';
import { checksRouter } from './checks/checks.router.ts';
import { ChecksService } from './checks/checks.service.ts';
import type { Config } from './config.ts';
import type { Db } from './db/client.ts';
import { healthRouter } from './health/health.router.ts';
import { JobQueue } from './jobs/job-queue.ts';
import { MaterialsRepository } from './materials/materials.repository.ts';
import { materialsRouter } from './materials/materials.router.ts';
import { MailDeliveryService, type SmtpTarget } from './mail/mail-delivery.service.ts';
import { outboxRouter } from './mail/outbox.router.ts';
import { OutboxService } from './mail/outbox.service.ts';
import { ReviewRepository } from './review/review.repository.ts';
import { inboxRouter } from './review/inbox.router.ts';
import { reviewRouter } from './review/review.router.ts';
import { ReviewService } from './review/review.service.ts';
import { ShopRepository } from './shop/shop.repository.ts';
import { shopRouter } from './shop/shop.router.ts';
import { ShopService } from './shop/shop.service.ts';
import { settingsRouter } from './settings/settings.router.ts';
import { LossPointsRepository } from './loss-points/loss-points.repository.ts';
import { lossPointsRouter } from './loss-points/loss-points.router.ts';
import { LossPointsService } from './loss-points/loss-points.service.ts';
import { materialLibraryRouter } from './materials/material-library.router.ts';
import { MaterialsService } from './materials/materials.service.ts';
import { compareRouter } from './compare/compare.router.ts';
import { CompareService } from './compare/compare.service.ts';
import { UserCoresRepository } from './catalogue/user-cores.repository.ts';
import { userCoresRouter } from './catalogue/user-cores.router.ts';
import { UserCoresService } from './catalogue/user-cores.service.ts';
import { buildOpenApiDocument, openApiRouter } from './openapi/openapi.ts';
import type { AppError } from './http/errors.ts';
import { apiNotFound, errorMiddleware } from './http/errors.ts';
import { noStore, securityHeaders } from './http/security-headers.ts';
import { storableInput } from './http/storable-input.ts';
import { signedInForWrites } from './http/access.ts';
import { staticAppRouter } from './http/static-app.ts';
import { adminUsersRouter } from './users/admin-users.router.ts';
import { UsersRepository } from './users/users.repository.ts';
import { UsersService } from './users/users.service.ts';

export interface AppDeps {
  config: Config;
  pool: pg.Pool;
  db: Db;
  logger: Logger;
  /** Where release mails go: a real relay, or the local fake SMTP server started beside the app. */
  mailTarget: SmtpTarget;
}

export interface Services {
  jobs: JobQueue;
  audit: AuditService;
  users: UsersService;
  catalogue: CatalogueService;
  materials: MaterialsRepository;
  /** Worker threads for the engine's long calls; closed with the app. */
  searchPool: SearchPool;
  calc: CalcService;
  materialLibrary: MaterialsService;
  lossPoints: LossPointsService;
  userCores: UserCoresService;
  mail: MailDeliveryService;
  shop: ShopService;
  review: ReviewService;
  outbox: OutboxService;
}

export function createServices({
  config,
  pool,
  db,
  logger,
  mailTarget,
}: Pick<AppDeps, 'config' | 'pool' | 'db' | 'logger' | 'mailTarget'>): Services {
  const jobs = new JobQueue({ pool, schema: config.jobs.schema, pollSeconds: config.jobs.pollSeconds, logger });
  const audit = new AuditService(new AuditRepository(db));
  const users = new UsersService(new UsersRepository(db), audit, config.bcryptCost);
  const catalogue = new CatalogueService();
  const materials = new MaterialsRepository(db);
  const searchPool = new SearchPool(config.search);
  const calc = new CalcService(catalogue, materials, searchPool);
  const lossPointsRepository = new LossPointsRepository(db);
  const materialLibrary = new MaterialsService(materials, audit, lossPointsRepository);
  const lossPoints = new LossPointsService(materialLibrary, lossPointsRepository, searchPool);
  const userCores = new UserCoresService(new UserCoresRepository(db), catalogue, audit);
  const mail = new MailDeliveryService(db, jobs, mailTarget, config.smtp.retryDelaysMs, logger);
  const shop = new ShopService(new ShopRepository(db), catalogue, mail, audit);
  const review = new ReviewService(new ReviewRepository(db), audit, shop);
  const outbox = new OutboxService(db);
  return { jobs, audit, users, catalogue, materials, searchPool, calc, materialLibrary, lossPoints, userCores, mail, shop, review, outbox };
}

export function createApp(deps: AppDeps) {
  const { config, pool, logger } = deps;
  const services = createServices(deps);
  const designsRepository = new DesignsRepository(deps.db);
  const designs = new DesignsService(designsRepository);
  const designEdits = new DesignEditsService(designsRepository, designs, new ConstructionEvaluator(services.calc), services.audit);
  const exports = new ExportsService(designs, new DesignMaterials(services.materials), services.calc);
  // Checks are only sent from here: check worker processes (server/workers/) work them.
  services.jobs.declareSendOnly(CHECK_JOB, CHECK_RETRY, CHECK_LIMITS);
  const checks = new ChecksService(new ChecksRepository(deps.db), designs, services.jobs);
  const { audit, users, catalogue, materials, calc, shop, review, outbox } = services;
  const compare = new CompareService(
    materials,
    { core: (id) => services.userCores.core(id), wire: (choice) => catalogue.wire(choice) },
    designs,
    services.searchPool,
  );
  const openApiDocument = buildOpenApiDocument();
  const sessions = createSessionMiddleware(config, pool);
  const passport = createPassport(users, sessions.readWithSession);
  const csrf = createCsrf(config);

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);
  app.use(
    pinoHttp({
      logger,
      // One short line per API request: no header dumps (cookies and tokens never reach the logs, and serialising
      // every header of every request was a large share of a request's cost).
      serializers: {
        ...logSerializers,
        req: (req: { id: unknown; method: string; url: string }) => ({ id: req.id, method: req.method, url: req.url }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
      customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : 'info'),
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
    }),
  );
  app.use(securityHeaders(config));

  // Health answers even when the session store (the database) is down.
  app.use('/api', healthRouter(pool), openApiRouter(openApiDocument));

  const api = express.Router();
  api.use(express.json({ limit: '1mb', strict: true }));
  api.use(storableInput);
  api.use(noStore);
  const fullSession = express.Router();
  fullSession.use(sessions.middleware, absoluteLifetime(config), idleRenewal(config), passport.initialize(), passport.session());
  const sessionLayer = createSessionLayer(config, pool, fullSession, sessions.readWithSession);
  api.use(sessionLayer.middleware);
  api.use(signedInForWrites);
  api.use(csrf.protection);
  api.use(authRouter({ config, passport, users, audit, issueCsrfToken: csrf.issueToken }));
  api.use(accountRouter(users, new SessionsRepository(deps.db)));
  api.use(adminUsersRouter(users));
  api.use(auditRouter(audit));
  api.use(calcRouter(calc));
  api.use(catalogueRouter(services.userCores));
  api.use(userCoresRouter(services.userCores));
  api.use(compareRouter(compare));
  const generationOf = (req: Request, name: string) => sessionLayer.extras(req)?.generations[name];
  api.use(designsRouter(designs, designEdits, generationOf));
  api.use(exportsRouter(exports));
  api.use(checksRouter(checks));
  api.use(lossPointsRouter(services.lossPoints));
  api.use(materialLibraryRouter(services.materialLibrary));
  api.use(materialsRouter(materials, generationOf));
  api.use(reviewRouter(review));
  api.use(inboxRouter(review));
  api.use(shopRouter(shop));
  api.use(outboxRouter(outbox));
  api.use(settingsRouter(shop));
  api.use(apiNotFound);
  app.use('/api', api);

  app.use(staticAppRouter(config.staticDir));
  const recordRefusal = (req: Request, err: AppError) =>
    audit
      .record({
        actorId: req.user?.id ?? null,
        action: 'access.denied',
        target: `${req.method} ${req.originalUrl.split('?')[0]}`.slice(0, 200),
        details: { status: err.status, role: req.user?.role ?? 'anonymous', reason: err.message },
        ip: req.ip,
      })
      .catch((e: unknown) => logger.warn({ err: e }, 'could not record an access refusal'));
  app.use(
    errorMiddleware((err, status) => {
      if (status >= 500) logger.error({ err: withoutQueryValues(err) }, 'request failed');
    }, recordRefusal),
  );

  return {
    app,
    services,
    /** Starts the background job workers (this instance then sends queued mail too). */
    start: () => services.jobs.start(),
    close: async () => {
      await services.jobs.stop();
      services.mail.close();
      await sessions.close();
      await services.searchPool.close();
    },
  };
}
