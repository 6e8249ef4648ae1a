import { coreLossRequestSchema, evaluateRequestSchema, operatingPointRequestSchema, searchRequestSchema } from '@shared/schemas/calc';
import {
  coreLossAnswerSchema,
  evaluateAnswerSchema,
  evaluateQuerySchema,
  operatingPointAnswerSchema,
  searchAnswerSchema,
} from '@shared/schemas/calc-answers';
import { defineEndpoint } from './endpoint';

export const operatingPoint = defineEndpoint({
  method: 'POST',
  path: '/calc/operating-point',
  access: 'signedIn',
  body: operatingPointRequestSchema,
  answer: operatingPointAnswerSchema,
  summary: 'Buck operating point: duty range, inductance, ripple, peak and RMS current, energy, CCM boundary, ripple harmonics',
});

export const coreLoss = defineEndpoint({
  method: 'POST',
  path: '/calc/core-loss',
  access: 'signedIn',
  body: coreLossRequestSchema,
  answer: coreLossAnswerSchema,
  summary: 'Core-loss density by Steinmetz (peak B = ΔB/2) and iGSE',
});

export const search = defineEndpoint({
  method: 'POST',
  path: '/calc/search',
  access: 'signedIn',
  body: searchRequestSchema,
  answer: searchAnswerSchema,
  summary: 'Ranked candidates over catalogue cores × materials × wire options, with the Pareto front and reasons for infeasible ones',
});

export const evaluate = defineEndpoint({
  method: 'POST',
  path: '/calc/evaluate',
  access: 'signedIn',
  query: evaluateQuerySchema,
  body: evaluateRequestSchema,
  answer: evaluateAnswerSchema,
  summary: 'Every figure of one explicit design (add ?sweep=frequency for a loss-versus-frequency sweep)',
});
