import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { UnitMeasurementRequest } from '@shared/schemas/review';
import type { UnitFinding } from '@shared/shop/measurement';
import type { WindingSheet } from '@shared/shop/sheet';
import type { Observable } from 'rxjs';

import { errorsShownByCaller } from '../core/error-display';

export interface OrderSummary {
  id: number;
  number: string;
  quantity: number;
  status: 'open' | 'complete';
  createdAt: string;
  completedAt: string | null;
  revisionId: number;
  revision: number;
  designId: number;
  designNumber: string;
  title: string;
  built: number;
  passed: number;
}

export interface BuiltUnit {
  id: number;
  unitNumber: number;
  inductance: number;
  testFrequency: number;
  resistance: number;
  resistanceTemperature: number;
  resistanceAt20: number;
  hipot: 'pass' | 'fail' | 'not_tested';
  passed: boolean;
  findings: UnitFinding[];
  notes: string | null;
  recordedAt: string;
}

export interface BuildOrder {
  id: number;
  number: string;
  revisionId: number;
  quantity: number;
  status: 'open' | 'complete';
  createdAt: string;
  completedAt: string | null;
  sheet: WindingSheet;
  units: BuiltUnit[];
}

export interface RecordedUnit {
  unit: BuiltUnit;
  orderStatus: 'open' | 'complete';
  passedUnits: number;
}

export interface PredictionSample {
  orderNumber: string;
  designNumber: string;
  revision: number;
  material: string;
  core: string;
  predictedInductance: number;
  measuredInductance: number;
  predictedResistance20: number;
  measuredResistance20: number;
  passed: boolean;
  inductanceRatio: number;
  resistanceRatio: number;
}

export interface RatioSummary {
  key: string;
  units: number;
  inductanceRatio: { mean: number; spread: number };
  resistanceRatio: { mean: number; spread: number };
}

export interface PredictionReport {
  units: PredictionSample[];
  byMaterial: RatioSummary[];
  byCore: RatioSummary[];
}

/** Build orders, their frozen winding sheets and the units built from them. */
@Injectable({ providedIn: 'root' })
export class ShopApi {
  private readonly http = inject(HttpClient);

  orders(status: 'open' | 'complete' | 'all'): Observable<{ orders: OrderSummary[] }> {
    return this.http.get<{ orders: OrderSummary[] }>('/api/shop/orders', { params: { status } });
  }

  order(id: number): Observable<BuildOrder> {
    return this.http.get<BuildOrder>(`/api/shop/orders/${id}`);
  }

  pdfUrl(id: number): string {
    return `/api/shop/orders/${id}/sheet.pdf`;
  }

  /** Failures come back to the form, which shows them under the fields. */
  recordUnit(id: number, measurement: UnitMeasurementRequest): Observable<RecordedUnit> {
    return this.http.post<RecordedUnit>(`/api/shop/orders/${id}/units`, measurement, errorsShownByCaller());
  }

  predictionReport(): Observable<PredictionReport> {
    return this.http.get<PredictionReport>('/api/shop/prediction-report');
  }
}
