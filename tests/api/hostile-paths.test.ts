// Path parameters and query strings: ids that are not stored ids, path traversal, bad paging, arrays and
// unknown parameters in the query.
import { describeHostileInput, type HostileCase } from './support/hostile-input.ts';

const CASES: HostileCase[] = [
  {
    name: 'non-numeric id in a path',
    who: 'admin',
    method: 'patch',
    url: '/api/admin/users/abc',
    body: { role: 'admin' },
    status: 400,
    field: 'id',
  },
  { name: 'overflowing id in a path', who: 'winder', method: 'get', url: '/api/shop/orders/99999999999', status: 400, field: 'id' },
  { name: 'exponent id in a path', who: 'winder', method: 'get', url: '/api/shop/orders/1e3', status: 400, field: 'id' },
  {
    name: 'path traversal in a path parameter',
    who: 'winder',
    method: 'get',
    url: '/api/shop/orders/..%2F..%2Fetc%2Fpasswd',
    status: [400, 404],
  },
  { name: 'non-numeric paging', who: 'admin', method: 'get', url: '/api/admin/audit?limit=abc', status: 400, field: 'limit' },
  { name: 'negative paging offset', who: 'admin', method: 'get', url: '/api/admin/audit?offset=-5', status: 400, field: 'offset' },
  {
    name: 'array in a query string',
    who: 'admin',
    method: 'get',
    url: '/api/admin/audit?limit[]=1&limit[]=2',
    status: 400,
    field: 'limit[]',
  },
  {
    name: 'unknown query parameter',
    who: 'winder',
    method: 'get',
    url: '/api/shop/orders?status=open&sort=evil',
    status: 400,
    field: 'sort',
  },
  { name: 'unknown order state', who: 'winder', method: 'get', url: '/api/shop/orders?status=everything', status: 400, field: 'status' },
];

describeHostileInput('hostile input: paths and query strings', CASES);
