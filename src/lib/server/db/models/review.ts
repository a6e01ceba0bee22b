// The review models, initialised on top of the core set (the same pattern as sharing.ts, so the
// review work registers its tables without editing the shared list in index.ts).
import { models } from './index';
import { Comment, initComment } from './comment';
import { initReview, ReviewAnswer, ReviewRequest } from './review-request';
import { initMeeting, Meeting, MeetingAttendee, MeetingItem } from './meeting';
import { ActivityEntry, initNotification, Notification } from './notification';

let ready = false;

export function reviewModels() {
	const core = models();
	if (!ready) {
		const sequelize = core.User.sequelize!;
		initComment(sequelize);
		initReview(sequelize);
		initMeeting(sequelize);
		initNotification(sequelize);
		Comment.belongsTo(core.User, { foreignKey: 'authorId', as: 'author' });
		ReviewRequest.hasMany(ReviewAnswer, { foreignKey: 'requestId', as: 'answers' });
		ReviewRequest.belongsTo(core.User, { foreignKey: 'requestedBy', as: 'requester' });
		ReviewAnswer.belongsTo(core.User, { foreignKey: 'reviewerId', as: 'reviewer' });
		Meeting.hasMany(MeetingItem, { foreignKey: 'meetingId', as: 'items' });
		Meeting.hasMany(MeetingAttendee, { foreignKey: 'meetingId', as: 'attendees' });
		MeetingAttendee.belongsTo(core.User, { foreignKey: 'userId', as: 'user' });
		ready = true;
	}
	return { ...core, Comment, ReviewRequest, ReviewAnswer, Meeting, MeetingAttendee, MeetingItem, Notification, ActivityEntry };
}
