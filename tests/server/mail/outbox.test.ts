// The tests that send from the shared outbox run one after another in this file: SKIP LOCKED hands each due row to
// whichever sender asks first, so senders of test files running side by side would take each other's mail.
import './subscribers.cases';
import './reminders.cases';
import './mail-fault-drill.cases';
import './invitations.cases';
