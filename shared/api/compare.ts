import {
  compareCurvesRequestSchema,
  compareCurvesResponseSchema,
  compareDesignRequestSchema,
  compareDesignResponseSchema,
  compareSavedDesignRequestSchema,
} from '@shared/schemas/compare';
import { defineEndpoint } from './endpoint';

export const compareCurves = defineEndpoint({
  method: 'POST',
  path: '/compare/curves',
  access: 'signedIn',
  body: compareCurvesRequestSchema,
  answer: compareCurvesResponseSchema,
  summary: 'Core-loss density of several materials over a frequency sweep and a ΔB sweep, fitted ranges and extrapolated points marked',
});

export const compareDesign = defineEndpoint({
  method: 'POST',
  path: '/compare/design',
  access: 'signedIn',
  body: compareDesignRequestSchema,
  answer: compareDesignResponseSchema,
  summary: 'One unsaved design (core, turns, wire) with every current material; gap re-solved per material',
});

export const compareSavedDesign = defineEndpoint({
  method: 'POST',
  path: '/compare/saved-design',
  access: 'signedIn',
  body: compareSavedDesignRequestSchema,
  answer: compareDesignResponseSchema,
  summary: 'A saved revision with every current material and its own material version (usedByDesign)',
  description: '404 for an unknown design or revision, 409 when the revision has no construction.',
});
