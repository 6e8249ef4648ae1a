// pg-boss ships its SQL statements in src/plans.js without type declarations; the job queue needs two of them to
// recognise the statements pg-boss runs without awaiting them.
declare module 'pg-boss/src/plans.js' {
  const plans: {
    completeJobs(schema: string): string;
    failJobsById(schema: string): string;
  };
  export default plans;
}
