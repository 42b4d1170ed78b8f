export interface AuditFilters { entity: string, entityId: string, actor: string, action: string, from: string, to: string }
