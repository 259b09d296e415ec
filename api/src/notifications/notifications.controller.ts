import { Body, Controller, Get, HttpCode, Param, ParseIntPipe, Patch, Post, Query } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  notificationListQuerySchema, notificationSchema, pageOf, unreadCountSchema, userPreferencesSchema,
  type NotificationDto, type NotificationListQuery, type Page, type UnreadCount, type UserPreferences,
} from '@sixtyfold/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ApiErrorResponses, ApiZodBody, ApiZodQuery, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { NotificationsService } from './notifications.service';

/** Each user's own notifications; nobody reads another's. */
@ApiTags('notifications')
@Controller('notifications')
export class NotificationsController {
  constructor(private readonly notifications: NotificationsService) {}

  @Get()
  @ApiOperation({ summary: 'My notifications, newest first; `unread=true` for the unread ones only' })
  @ApiZodQuery(notificationListQuerySchema)
  @ApiZodResponse(200, pageOf(notificationSchema), 'One page of notifications')
  @ApiErrorResponses(400, 401)
  list(@CurrentUser() user: SessionUser, @Query(new ZodValidationPipe(notificationListQuerySchema)) query: NotificationListQuery): Promise<Page<NotificationDto>> {
    return this.notifications.list(user, query);
  }

  @Get('unread-count')
  @ApiOperation({ summary: 'How many of my notifications are unread' })
  @ApiZodResponse(200, unreadCountSchema, 'The unread count')
  @ApiErrorResponses(401)
  async unreadCount(@CurrentUser() user: SessionUser): Promise<UnreadCount> {
    return { unread: await this.notifications.unreadCount(user) };
  }

  @Post('read-all')
  @HttpCode(200)
  @ApiOperation({ summary: 'Mark all my notifications read' })
  @ApiZodResponse(200, unreadCountSchema, 'The unread count afterwards (0)')
  @ApiErrorResponses(401)
  async readAll(@CurrentUser() user: SessionUser): Promise<UnreadCount> {
    await this.notifications.markAllRead(user);
    return { unread: await this.notifications.unreadCount(user) };
  }

  @Post(':id/read')
  @HttpCode(200)
  @ApiOperation({ summary: 'Mark one of my notifications read' })
  @ApiZodResponse(200, notificationSchema, 'The notification')
  @ApiErrorResponses(400, 401, 404)
  read(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<NotificationDto> {
    return this.notifications.markRead(user, id);
  }
}

/** The signed-in user's own settings. */
@ApiTags('auth')
@Controller('auth/me/preferences')
export class PreferencesController {
  constructor(private readonly notifications: NotificationsService) {}

  @Get()
  @ApiOperation({ summary: 'My preferences: how notifications reach me by e-mail' })
  @ApiZodResponse(200, userPreferencesSchema, 'My preferences')
  @ApiErrorResponses(401)
  get(@CurrentUser() user: SessionUser): Promise<UserPreferences> {
    return this.notifications.preferences(user);
  }

  @Patch()
  @ApiOperation({ summary: "Change my preferences; 'daily' collects notifications into one morning digest" })
  @ApiZodBody(userPreferencesSchema)
  @ApiZodResponse(200, userPreferencesSchema, 'My preferences as stored')
  @ApiErrorResponses(400, 401)
  set(@CurrentUser() user: SessionUser, @Body(new ZodValidationPipe(userPreferencesSchema)) body: UserPreferences): Promise<UserPreferences> {
    return this.notifications.setPreferences(user, body);
  }
}
