/** The notices feature's public surface: any feature queues a notice with notify(). */
export {
  actorName,
  notify,
  subscribers,
  type Notice,
  type NoticeAudience,
} from './notices.service';
