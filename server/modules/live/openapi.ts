// The OpenAPI description of the hand-offs and live-stream routes (routes.ts beside it).
import { HandOffList, HandOffsUnread, MarkHandOffsRead } from '@shared/schemas/hand-offs';
import { z } from 'zod';
import { describeRoute } from '../../lib/openapi';

describeRoute({
  method: 'get',
  path: '/hand-offs',
  summary: 'Your hand-offs (what the desk wrote you), newest first, with the unread count',
  tags: ['hand-offs'],
  response: HandOffList,
});
describeRoute({
  method: 'post',
  path: '/hand-offs/read',
  summary: 'Mark some of your hand-offs (ids) or all of them read',
  tags: ['hand-offs'],
  body: MarkHandOffsRead,
  response: HandOffsUnread,
});
describeRoute({
  method: 'get',
  path: '/live',
  summary:
    'Server-sent events: "package" (data: packageId) when a package you may see changes, "handoff" when the desk writes you',
  tags: ['hand-offs'],
  response: z.string(),
  responseContentType: 'text/event-stream',
});
