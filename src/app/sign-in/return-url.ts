/** Only a path inside this app may be returned to after sign-in; anything else goes home. */
export function safeReturnUrl(candidate: string | null | undefined): string {
  if (!candidate || !candidate.startsWith('/') || candidate.startsWith('//') || candidate.startsWith('/\\')) return '/';
  if (candidate.startsWith('/sign-in')) return '/';
  return candidate;
}
