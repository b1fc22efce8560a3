import type { Sequelize } from 'sequelize';
import { IdempotencyKey } from './idempotency-key';
import { InstallSetting } from './install-setting';
import { Job } from './job';
import { JobCompletion } from './job-completion';
import { JobNote } from './job-note';
import { JobPhoto } from './job-photo';
import { JobTick } from './job-tick';
import { Space } from './space';
import { User } from './user';

export { IdempotencyKey, InstallSetting, JobCompletion, JobNote, JobPhoto, JobTick };

function associateInstaller() {
  for (const M of [JobTick, JobNote, JobPhoto, JobCompletion] as const) {
    (M as typeof JobTick).belongsTo(User, { as: 'user', foreignKey: 'userId' });
  }
  JobTick.belongsTo(Job, { as: 'job', foreignKey: 'jobId' });
  JobPhoto.belongsTo(Space, { as: 'space', foreignKey: 'spaceId' });
}

/** The installer's models (migration 0200), appended to MODEL_REGISTRY in index.ts. */
export const INSTALLER_MODELS: Array<{ init: (s: Sequelize) => void; associate?: () => void }> = [
  { init: (s) => InstallSetting.initModel(s) },
  { init: (s) => JobTick.initModel(s) },
  { init: (s) => JobNote.initModel(s) },
  { init: (s) => JobPhoto.initModel(s) },
  { init: (s) => JobCompletion.initModel(s) },
  { init: (s) => IdempotencyKey.initModel(s) },
  { init: () => undefined, associate: associateInstaller },
];
