import { Banner } from '../ui';

import type { FormStatus } from './server-errors';

/** The form-wide error a submit left in Formik's status (one that no single field owns), if any. */
export function FormErrorBanner({ status, title }: { status: unknown; title?: string }) {
  const error = (status as FormStatus)?.error;
  return error ? (
    <Banner tone="fail" title={title}>
      {error}
    </Banner>
  ) : null;
}
