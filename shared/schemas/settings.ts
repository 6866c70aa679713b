import * as yup from 'yup';
import { UNIT_SYSTEMS } from './common';

export const settingsPatchSchema = yup
  .object({
    unitSystem: yup
      .string()
      .strict()
      .oneOf([...UNIT_SYSTEMS], `Unit system must be one of ${UNIT_SYSTEMS.join(', ')}`)
      .required('Unit system is required'),
  })
  .noUnknown()
  .strict();
export type SettingsPatchInput = yup.InferType<typeof settingsPatchSchema>;
