import { getSequelize } from '@/lib/db/connection';
import { initUser, User, UserRole } from './user';
import {
  initCorrelation, Correlation, CorrelationVersion, CheckCaseRow, ValidationRun, SignOff, VersionComment,
} from './correlation';
import { initRecords, AuditEvent, Notification, ApiToken } from './records';

let ready = false;

/** Initialises every model and association once, on the shared Sequelize instance. */
export function db() {
  const sequelize = getSequelize();
  if (!ready) {
    initUser(sequelize);
    initCorrelation(sequelize);
    initRecords(sequelize);
    User.hasMany(UserRole, { as: 'roles', foreignKey: 'userId' });
    UserRole.belongsTo(User, { foreignKey: 'userId' });
    Correlation.hasMany(CorrelationVersion, { as: 'versions', foreignKey: 'correlationId' });
    CorrelationVersion.belongsTo(Correlation, { as: 'correlation', foreignKey: 'correlationId' });
    CorrelationVersion.hasMany(CheckCaseRow, { as: 'checkCases', foreignKey: 'versionId' });
    ready = true;
  }
  return {
    sequelize, User, UserRole, Correlation, CorrelationVersion, CheckCaseRow, ValidationRun, SignOff,
    VersionComment, AuditEvent, Notification, ApiToken,
  };
}

export { User, UserRole, Correlation, CorrelationVersion, CheckCaseRow, ValidationRun, SignOff, VersionComment,
  AuditEvent, Notification, ApiToken };
export { ROLES, type Role } from './user';
export { VERSION_STATUSES, type VersionStatus } from './correlation';
