// Defaults without the schema library, so the first screen can load without it.
// test/store/records.test.ts checks that this equals Settings.parse({ id: 'settings' }).
import type { Settings } from './schema';

export const DEFAULT_SETTINGS: Settings = {
  id: 'settings',
  operator: '',
  activityModel: 'auto',
  conductanceFactor: 1.5e-5,
  profileId: 'bankside-default',
  projectId: '',
  organizationId: '',
  units: { alkalinity: 'mg/L CaCO3', conductance: 'uS/cm', pressure: 'hPa', do: 'mg/L' },
  office: { endpoint: '', token: '', method: 'POST' },
};
