import { loadCentreLegs, loadCoreCatalogue } from '@core-data/catalogue';
import type { CentreLeg } from '@shared/catalogue/bobbin-estimate';
import { loadStandardWireOptions, loadWireTables } from '@core-data/wire-catalogue';
import { standardFoilOptions } from '@shared/catalogue/foil';
import type { CoreShape, WireOption } from '@shared/engine/types';
import { wireOptionFromChoice, type WireChoice } from '@shared/catalogue/wire-from-request';
import { badRequest } from '../http/errors.ts';

/**
 * The shipped core and wire catalogues, loaded and validated once on first use, plus the current user
 * cores (kept here by UserCoresService after every change, so searches and evaluations include them).
 */
export class CatalogueService {
  private coresById?: Map<string, CoreShape>;
  private wireOptions?: WireOption[];
  private userCores: CoreShape[] = [];

  /** Shipped cores and current, not retired user cores. */
  cores(): CoreShape[] {
    return [...this.coreIndex().values(), ...this.userCores];
  }

  shippedCores(): CoreShape[] {
    return [...this.coreIndex().values()];
  }

  setUserCores(cores: CoreShape[]): void {
    this.userCores = cores.filter((c) => !this.coreIndex().has(c.id));
  }

  core(id: string): CoreShape {
    const core = this.coreIndex().get(id) ?? this.userCores.find((c) => c.id === id);
    if (!core) throw badRequest(`No core "${id}" in the catalogue.`, { coreId: `Unknown core "${id}"` });
    return core;
  }

  /** A shipped core's centre leg (the field check's planar E/EFD model); undefined for a user core. */
  centreLeg(id: string): CentreLeg | undefined {
    return loadCentreLegs().get(id);
  }

  standardWires(): WireOption[] {
    return (this.wireOptions ??= [...loadStandardWireOptions(), ...standardFoilOptions()]);
  }

  wire(choice: WireChoice): WireOption {
    return wireOptionFromChoice(choice, loadWireTables());
  }

  private coreIndex(): Map<string, CoreShape> {
    return (this.coresById ??= new Map(loadCoreCatalogue().map((c) => [c.id, c])));
  }
}
