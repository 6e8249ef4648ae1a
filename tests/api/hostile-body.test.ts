// Request bodies that are not the JSON object a route expects: wrong shape, wrong content type, broken or
// oversized JSON, invalid UTF-8, fields the route does not know.
import { describeHostileInput, SPEC, type HostileCase } from './support/hostile-input.ts';

const nested = (depth: number) => '['.repeat(depth) + ']'.repeat(depth);

const CASES: HostileCase[] = [
  { name: 'array instead of an object', who: 'engineer', method: 'post', url: '/api/calc/operating-point', body: [SPEC], status: 400 },
  {
    name: 'null body',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    raw: { type: 'application/json', data: 'null' },
    status: 400,
  },
  {
    name: 'JSON sent as text/plain',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    raw: { type: 'text/plain', data: JSON.stringify(SPEC) },
    status: 400,
  },
  {
    name: 'malformed JSON',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/search',
    raw: { type: 'application/json', data: '{"spec": {"vinMin": 24,,}}' },
    status: 400,
  },
  {
    name: 'a 10 MB body',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/search',
    raw: { type: 'application/json', data: JSON.stringify({ spec: SPEC, padding: 'x'.repeat(10 * 1024 * 1024) }) },
    status: 413,
  },
  {
    name: 'JSON nested 5,000 deep',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/search',
    raw: { type: 'application/json', data: `{"spec": ${nested(5000)}}` },
    status: 400,
    field: 'spec',
  },
  {
    name: 'unknown field alongside valid ones',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    body: { ...SPEC, debug: true },
    status: 400,
    field: 'debug',
  },
  {
    name: 'invalid UTF-8 in a JSON body',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    raw: {
      type: 'application/json; charset=utf-8',
      data: Buffer.concat([Buffer.from('{"vinMin": 24, "note": "'), Buffer.from([0xc3, 0x28, 0xff]), Buffer.from('"}')]),
    },
    status: 400,
  },
];

describeHostileInput('hostile input: request bodies', CASES);
