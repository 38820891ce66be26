// Every model and association, registered once on the shared Sequelize instance.
import { User } from './User';
import { Session } from './Session';
import { Account } from './Account';
import { Verification } from './Verification';
import { Song } from './Song';
import { StudioLink } from './StudioLink';
import { Recording } from './Recording';
import { Analysis } from './Analysis';
import { AnalysisJob } from './AnalysisJob';
import { CandidateTempo } from './CandidateTempo';
import { PracticeEntry } from './PracticeEntry';
import { Passage } from './Passage';
import { StudioInvitation } from './StudioInvitation';
import { RecordingNote } from './RecordingNote';
import { SetList, SetListItem } from './SetList';
import { TempoMark } from './TempoMark';

User.hasMany(Song, { foreignKey: 'ownerId', as: 'songs', onDelete: 'CASCADE' });
Song.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });
StudioLink.belongsTo(User, { foreignKey: 'studentId', as: 'student' });
StudioLink.belongsTo(User, { foreignKey: 'teacherId', as: 'teacher' });
Song.hasMany(Recording, { foreignKey: 'songId', as: 'recordings', onDelete: 'CASCADE' });
Recording.belongsTo(Song, { foreignKey: 'songId', as: 'song' });
Recording.hasOne(Analysis, { foreignKey: 'recordingId', as: 'analysis', onDelete: 'CASCADE' });
Recording.hasOne(AnalysisJob, { foreignKey: 'recordingId', as: 'job', onDelete: 'CASCADE' });
Song.hasMany(CandidateTempo, { foreignKey: 'songId', as: 'candidates', onDelete: 'CASCADE' });
Song.hasMany(PracticeEntry, { foreignKey: 'songId', as: 'practice', onDelete: 'CASCADE' });
RecordingNote.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
Song.hasMany(Passage, { foreignKey: 'songId', as: 'passages', onDelete: 'CASCADE' });
Passage.belongsTo(Recording, { foreignKey: 'recordingId', as: 'recording' });
Recording.hasMany(TempoMark, { foreignKey: 'recordingId', as: 'tempoMarks', onDelete: 'CASCADE' });

/** better-auth's model names (after our modelName mapping) → the Sequelize model that stores them. */
export const authModels = { users: User, sessions: Session, accounts: Account, verifications: Verification } as const;

export {
  User,
  Session,
  Account,
  Verification,
  Song,
  StudioLink,
  Recording,
  Analysis,
  AnalysisJob,
  CandidateTempo,
  PracticeEntry,
  Passage,
  StudioInvitation,
  RecordingNote,
  SetList,
  SetListItem,
  TempoMark,
};
