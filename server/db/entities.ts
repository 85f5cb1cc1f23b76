import { CohortInvitationEntity } from '../entities/cohort-invitation.entity';
import { CohortMembershipEntity } from '../entities/cohort-membership.entity';
import { CohortEntity } from '../entities/cohort.entity';
import { SessionEntity } from '../entities/session.entity';
import { UserTokenEntity } from '../entities/user-token.entity';
import { UserEntity } from '../entities/user.entity';

/** Every entity, as a class array (no globs: tsx and the bundler both see them). */
export const entities = [UserEntity, SessionEntity, UserTokenEntity, CohortEntity, CohortMembershipEntity, CohortInvitationEntity];
