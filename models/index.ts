import { getSequelize } from '@/lib/db/connection';
import { initUser, User, UserRole } from './user';
import {
  initCorrelation, Correlation, CorrelationVersion, CheckCaseRow, ValidationRun, SignOff, VersionComment,
} from './correlation';
import { initRecords, AuditEvent, Notification, ApiToken, Attachment } from './records';
import { initCalculation, Project, ProjectMember, Calculation, CalculationRevision, CalculationUse, TemplateDependency } from './calculation';

let ready = false;

/** Initialises every model and association once, on the shared Sequelize instance. */
export function db() {
  const sequelize = getSequelize();
  if (!ready) {
    initUser(sequelize);
    initCorrelation(sequelize);
    initRecords(sequelize);
    initCalculation(sequelize);
    User.hasMany(UserRole, { as: 'roles', foreignKey: 'userId' });
    UserRole.belongsTo(User, { foreignKey: 'userId' });
    Correlation.hasMany(CorrelationVersion, { as: 'versions', foreignKey: 'correlationId' });
    CorrelationVersion.belongsTo(Correlation, { as: 'correlation', foreignKey: 'correlationId' });
    CorrelationVersion.hasMany(CheckCaseRow, { as: 'checkCases', foreignKey: 'versionId' });
    Project.hasMany(Calculation, { as: 'calculations', foreignKey: 'projectId' });
    Calculation.belongsTo(Project, { as: 'project', foreignKey: 'projectId' });
    Calculation.hasMany(CalculationRevision, { as: 'revisions', foreignKey: 'calculationId' });
    ready = true;
  }
  return {
    sequelize, User, UserRole, Correlation, CorrelationVersion, CheckCaseRow, ValidationRun, SignOff,
    VersionComment, AuditEvent, Notification, ApiToken, Attachment, Project, ProjectMember, Calculation, CalculationRevision,
    CalculationUse, TemplateDependency,
  };
}

export { User, UserRole, Correlation, CorrelationVersion, CheckCaseRow, ValidationRun, SignOff, VersionComment,
  AuditEvent, Notification, ApiToken, Attachment };
export { Project, ProjectMember, Calculation, CalculationRevision, CalculationUse, TemplateDependency };
export { PROJECT_ROLES, type ProjectRole } from './calculation';
export { ROLES, type Role } from './user';
export { VERSION_STATUSES, type VersionStatus, ENTRY_KINDS, type EntryKind } from './correlation';
