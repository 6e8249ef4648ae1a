import * as z from 'zod';
import {
  fitAcceptAnswerSchema,
  fitAcceptSchema,
  fitAnswerSchema,
  fitOptionsSchema,
  lossPointCommitSchema,
  lossPointPreviewSchema,
  lossPointsAnswerSchema,
} from '@shared/schemas/loss-points';
import { defineEndpoint } from './endpoint';
import { idParamsSchema } from './params';

export const lossPoints = defineEndpoint({
  method: 'GET',
  path: '/materials/:id/loss-points',
  access: 'signedIn',
  params: idParamsSchema,
  answer: lossPointsAnswerSchema,
  summary: 'The loss points of one material version (SI units, °C), in file order',
});

export const lossPointTemplate = defineEndpoint({
  method: 'GET',
  path: '/materials/loss-points/template.csv',
  access: 'signedIn',
  answer: z.void(),
  produces: 'text/csv',
  summary: 'Loss-point CSV template: invented points of an illustrative ferrite',
});

export const previewLossPoints = defineEndpoint({
  method: 'POST',
  path: '/materials/:id/loss-points/preview',
  access: 'upload',
  params: idParamsSchema,
  upload: 'preview',
  answer: lossPointPreviewSchema,
  summary: 'Every row of a loss-point CSV file with its problems by column, and the problems across rows; nothing written',
});

export const commitLossPoints = defineEndpoint({
  method: 'POST',
  path: '/materials/:id/loss-points/commit',
  access: 'upload',
  params: idParamsSchema,
  upload: 'commit',
  answer: lossPointCommitSchema,
  status: 201,
  summary: 'All points of a loss-point CSV file, or none, on a new version of the current material version',
  description: 'The earlier version keeps its own points. 409 when the version is no longer current.',
});

export const fitLossPoints = defineEndpoint({
  method: 'POST',
  path: '/materials/:id/fit',
  access: 'upload',
  params: idParamsSchema,
  body: fitOptionsSchema,
  answer: fitAnswerSchema,
  summary: 'Steinmetz k, α, β (whole range or bands) and the temperature behaviour fitted to the version’s loss points',
  description: 'Answers each fit’s quality, residuals per point and fitted curves per measured frequency; nothing written.',
});

export const acceptFit = defineEndpoint({
  method: 'POST',
  path: '/materials/:id/fit/accept',
  access: 'upload',
  params: idParamsSchema,
  body: fitAcceptSchema,
  answer: fitAcceptAnswerSchema,
  status: 201,
  summary: 'The fit made again from the stored points as a new material version (ranges exactly the points’ ranges)',
});
