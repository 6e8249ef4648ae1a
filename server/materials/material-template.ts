import type { MaterialCsvColumn } from '@shared/schemas/material-csv';

/**
 * The downloadable template: two invented, illustrative materials, one in each unit set. Neither is any
 * maker's grade. The ferrite's k gives about 80 kW/m³ at 100 kHz and 0.1 T peak, the powder's about
 * 300 mW/cm³ at 100 kHz and 50 mT peak (plausible orders of magnitude; common practice, no source). The
 * ferrite loses least at 90 °C (factor 1 there, rising by 1e-4 per K² away from it) and its k holds at its t_ref of
 * 90 °C; it states no max_temperature (the ferrite default applies), the powder an invented binder limit of 150 °C.
 * The powder's permeability has halved at 5,000 A/m, falling with steepness 1.8. The ferrite's core loss doubles under
 * a DC bias field of 60 A/m in the ferrite, rising with steepness 1.5 (invented, of the order such data show).
 */
export const TEMPLATE_ROWS: Record<MaterialCsvColumn, string>[] = [
  {
    name: 'Example ferrite EF-1 (illustrative)',
    family: 'ferrite',
    unit_set: 'W/m3-Hz-T',
    k: '3.2',
    alpha: '1.4',
    beta: '2.6',
    f_min: '50000',
    f_max: '300000',
    b_min: '0.02',
    b_max: '0.25',
    lowest_loss_temperature: '90',
    lowest_loss_factor: '1',
    loss_curvature: '0.0001',
    t_ref: '90',
    max_temperature: '',
    bsat_25: '0.5',
    bsat_100: '0.4',
    mu_i: '2300',
    rolloff_half_field: '',
    rolloff_steepness: '',
    bias_loss_doubling_field: '60',
    bias_loss_steepness: '1.5',
    density: '4800',
    provenance: 'Invented example, illustrative only',
  },
  {
    name: 'Example powder EP-2 (illustrative)',
    family: 'powder',
    unit_set: 'mW/cm3-kHz-mT',
    k: '0.00014',
    alpha: '1.3',
    beta: '2.2',
    f_min: '20',
    f_max: '200',
    b_min: '10',
    b_max: '200',
    lowest_loss_temperature: '',
    lowest_loss_factor: '',
    loss_curvature: '',
    t_ref: '',
    max_temperature: '150',
    bsat_25: '1000',
    bsat_100: '950',
    mu_i: '60',
    rolloff_half_field: '5000',
    rolloff_steepness: '1.8',
    bias_loss_doubling_field: '',
    bias_loss_steepness: '',
    density: '6500',
    provenance: 'Invented example, illustrative only',
  },
];
