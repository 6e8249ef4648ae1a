import type { Db } from '../db/client.ts';
import type { Services } from '../app.ts';
import { ExportsService } from '../exports/exports.service.ts';
import { DesignsRepository } from './designs.repository.ts';
import { DesignsService } from './designs.service.ts';

/** The design workspace's services, built on the app's shared ones. */
export function createDesignServices(db: Db, services: Pick<Services, 'calc' | 'materials' | 'audit'>) {
  const designs = new DesignsService(new DesignsRepository(db), services.calc, services.materials, services.audit);
  const exports = new ExportsService(designs, services.calc);
  return { designs, exports };
}
