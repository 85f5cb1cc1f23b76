import { AuditEntryEntity } from '../entities/audit-entry.entity';
import { CohortInvitationEntity } from '../entities/cohort-invitation.entity';
import { CohortMembershipEntity } from '../entities/cohort-membership.entity';
import { CohortEntity } from '../entities/cohort.entity';
import { GardenEntity } from '../entities/garden.entity';
import { HarvestEntity } from '../entities/harvest.entity';
import { PlotLogTotalEntity, TrialLogSummaryEntity, TrialWeekWaterEntity } from '../entities/log-rollups.entity';
import { MoistureReadingEntity } from '../entities/moisture-reading.entity';
import { NotificationPreferenceEntity } from '../entities/notification-preference.entity';
import { NotificationSendEntity } from '../entities/notification-send.entity';
import { ObservationEntity } from '../entities/observation.entity';
import { PhotoEntity } from '../entities/photo.entity';
import { PlotEntity } from '../entities/plot.entity';
import { PotEntity } from '../entities/pot.entity';
import { SeepTestEntity } from '../entities/seep-test.entity';
import { SessionEntity } from '../entities/session.entity';
import { TrialExclusionEntity } from '../entities/trial-exclusion.entity';
import { TrialShareEntity } from '../entities/trial-share.entity';
import { TrialEntity } from '../entities/trial.entity';
import { UserTokenEntity } from '../entities/user-token.entity';
import { UserEntity } from '../entities/user.entity';
import { WaterEventEntity } from '../entities/water-event.entity';
import { WeatherDayEntity } from '../entities/weather-day.entity';

/** Every entity, as a class array (no globs: tsx and the bundler both see them). */
export const entities = [
  UserEntity,
  SessionEntity,
  UserTokenEntity,
  CohortEntity,
  CohortMembershipEntity,
  CohortInvitationEntity,
  GardenEntity,
  TrialEntity,
  PlotEntity,
  PotEntity,
  SeepTestEntity,
  WaterEventEntity,
  MoistureReadingEntity,
  HarvestEntity,
  ObservationEntity,
  PhotoEntity,
  WeatherDayEntity,
  AuditEntryEntity,
  TrialShareEntity,
  TrialExclusionEntity,
  NotificationPreferenceEntity,
  NotificationSendEntity,
  TrialLogSummaryEntity,
  PlotLogTotalEntity,
  TrialWeekWaterEntity,
];
