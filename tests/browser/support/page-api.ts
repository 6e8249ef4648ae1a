// Requests sent from inside a signed-in page, as the app itself sends them (session cookie, CSRF header).

const csrfHeader = `'X-XSRF-TOKEN': decodeURIComponent(/XSRF-TOKEN=([^;]+)/.exec(document.cookie)[1])`;

/** Script for page.evaluate: a JSON write; resolves to the answer's status. */
export const apiWrite = (method: string, url: string, body: unknown) =>
  `fetch(${JSON.stringify(url)}, { method: ${JSON.stringify(method)}, headers: { 'Content-Type': 'application/json', ${csrfHeader} }, body: ${JSON.stringify(JSON.stringify(body))} }).then((r) => r.status)`;

/** Script for page.evaluate: a JSON write; resolves to the answer's body. */
export const apiWriteJson = (method: string, url: string, body: unknown) =>
  apiWrite(method, url, body).replace('.then((r) => r.status)', '.then((r) => r.json())');

/** Script for page.evaluate: a CSV file committed to an import URL with no decisions; resolves to the answer's body. */
export const csvCommit = (url: string, csv: string, fileName: string) =>
  `(() => { const form = new FormData(); form.append('decisions', '{}'); form.append('file', new Blob([${JSON.stringify(csv)}], { type: 'text/csv' }), ${JSON.stringify(fileName)}); return fetch(${JSON.stringify(url)}, { method: 'POST', headers: { ${csrfHeader} }, body: form }).then((r) => r.json()); })()`;
