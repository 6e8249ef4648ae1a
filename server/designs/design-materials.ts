import type { DesignSpec } from '@shared/schemas/designs';
import { distinct, isStoredIdText } from '@shared/schemas/ids';
import type { MaterialsRepository } from '../materials/materials.repository.ts';

/** The stored materials a saved design names or searches, for its exports. */
export class DesignMaterials {
  constructor(private readonly materials: MaterialsRepository) {}

  async names(): Promise<Map<string, string>> {
    const rows = await this.materials.listCurrent(true);
    return new Map(rows.map((r) => [String(r.id), r.name]));
  }

  /**
   * The stored materials a saved spec searches: its own list, else every current material. Ids in the list
   * that are not stored ids (a spec saved before ids were range-checked may hold "99999999999") or name no
   * stored material are left out, so such a design still exports its candidates.
   */
  async searchIds(spec: DesignSpec): Promise<string[]> {
    if (!spec.materialIds?.length) return (await this.materials.listCurrent()).map((r) => String(r.id));
    const wanted = distinct(spec.materialIds.filter(isStoredIdText).map(Number));
    const stored = new Set((await this.materials.findByIds(wanted)).map((r) => r.id));
    return wanted.filter((id) => stored.has(id)).map(String);
  }
}
