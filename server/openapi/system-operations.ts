import { z } from 'zod';
import { auditActorSchema, auditFilterSchema, auditPageSchema, auditQuerySchema, healthSchema, readinessSchema, signingKeySchema, trailCheckSchema } from '../../shared/api';
import type { Operation } from './operation';

/** The system trail, the published keys, and what operators and monitoring read. */
export const SYSTEM_OPERATIONS: Operation[] = [
  { method: 'get', path: '/api/audit', summary: 'A page of the system trail, newest first', tags: ['Audit'], access: ['auditor', 'admin'], query: auditQuerySchema, response: auditPageSchema },
  { method: 'get', path: '/api/audit/actors', summary: 'The people who appear in the trail', tags: ['Audit'], access: ['auditor', 'admin'], response: z.array(auditActorSchema) },
  { method: 'get', path: '/api/audit/trail-check', summary: 'Check the whole trail against its hash chain', tags: ['Audit'], access: ['auditor', 'admin'], response: trailCheckSchema },
  {
    method: 'get',
    path: '/api/audit/export.csv',
    summary: 'Export the filtered trail as CSV',
    description: 'Recorded in the trail itself (`audit.exported`).',
    tags: ['Audit'],
    access: ['auditor', 'admin'],
    query: auditFilterSchema,
    media: { type: 'text/csv', description: 'id, time, actor, action, target_type, target_id, details.' },
  },
  {
    method: 'get',
    path: '/api/signing-keys',
    summary: 'Every public key results were signed with, newest first',
    description: 'Public, like any published public key: partner labs check exported reports against it.',
    tags: ['Integrity'],
    access: 'public',
    response: z.array(signingKeySchema),
  },
  { method: 'get', path: '/api/health', summary: 'The process lives', tags: ['Operations'], access: 'public', response: healthSchema },
  {
    method: 'get',
    path: '/api/ready',
    summary: 'The database, the job queue and the archive answer',
    description: '503 with the same body naming the part that does not, and while the API stops.',
    tags: ['Operations'],
    access: 'public',
    response: readinessSchema,
  },
  {
    method: 'get',
    path: '/metrics',
    summary: 'Prometheus metrics',
    description: 'For a scraper holding `BELLKEEP_METRICS_TOKEN` as its bearer token, or a signed-in admin.',
    tags: ['Operations'],
    access: ['admin'],
    media: { type: 'text/plain', description: 'The Prometheus text format.' },
  },
  { method: 'get', path: '/api/openapi.json', summary: 'This document', tags: ['Operations'], access: 'public', response: z.looseObject({ openapi: z.literal('3.1.0') }).meta({ description: 'OpenAPI 3.1.' }) },
  { method: 'get', path: '/api/reference', summary: 'This document as a browsable page', tags: ['Operations'], access: 'public', media: { type: 'text/html', description: 'The reference page.' } },
  {
    method: 'get',
    path: '/api/reference/{file}',
    summary: 'A file of the reference page',
    description: 'Its script and style, Swagger UI’s, and the font.',
    tags: ['Operations'],
    access: 'public',
    media: { type: 'application/octet-stream', description: 'The file.' },
    errors: { 404: 'The page has no such file.' },
  },
];
