import { Global, Module } from '@nestjs/common';
import { DevMailController } from './dev-mail.controller';
import { MailOutbox } from './mail-outbox.service';
import { MailService } from './mail.service';

/** E-mail: the SMTP sender, the outbox every feature queues messages in, and the dev inbox. */
@Global()
@Module({
  controllers: [DevMailController],
  providers: [MailService, MailOutbox],
  exports: [MailService, MailOutbox],
})
export class MailModule {}
