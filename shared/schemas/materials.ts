// The material feature's schemas in one import: the CSV format, the stored values, the requests and the
// answers each live in a module of their own; the import preview is shared with the other libraries.
export * from './csv-import';
export * from './material-answers';
export * from './material-csv';
export * from './material-requests';
export * from './material-values';
export * from './material-warnings';
