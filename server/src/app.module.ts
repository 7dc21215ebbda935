import { Module } from '@nestjs/common';
import { ConfigModule, ConfigService } from '@nestjs/config';
import { APP_FILTER, APP_GUARD, APP_PIPE } from '@nestjs/core';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuthModule } from './auth/auth.module';
import { CommandsModule } from './commands/commands.module';
import { CustomersModule } from './customers/customers.module';
import { JobsModule } from './jobs/jobs.module';
import { VehiclesModule } from './vehicles/vehicles.module';
import { JwtAuthGuard } from './auth/jwt-auth.guard';
import { RolesGuard } from './auth/roles.guard';
import { AllExceptionsFilter } from './common/all-exceptions.filter';
import { createValidationPipe } from './common/validation.pipe';
import { type EnvironmentVariables, validateEnv } from './config/env.validation';
import { dataSourceOptions } from './database/data-source';
import { HealthModule } from './health/health.module';
import { InvitesModule } from './invites/invites.module';
import { PhotosModule } from './photos/photos.module';
import { SignaturesModule } from './signatures/signatures.module';
import { InvoicesModule } from './invoices/invoices.module';
import { LedgerModule } from './ledger/ledger.module';
import { PaymentsModule } from './payments/payments.module';
import { QuotesModule } from './quotes/quotes.module';
import { AuditModule } from './audit/audit.module';
import { BusinessesModule } from './businesses/businesses.module';
import { UsersModule } from './users/users.module';
import { SyncModule } from './sync/sync.module';
import { ChecklistModule } from './checklist/checklist.module';
import { ChipsModule } from './chips/chips.module';
import { ClimateModule } from './climate/climate.module';
import { MaskingModule } from './masking/masking.module';
import { PassesModule } from './passes/passes.module';
import { PinsModule } from './pins/pins.module';
import { ProductsModule } from './products/products.module';
import { ReadingsModule } from './readings/readings.module';
import { SolventsModule } from './solvents/solvents.module';
import { TimersModule } from './timers/timers.module';
import { WorkspaceModule } from './workspace/workspace.module';
import { MailModule } from './mail/mail.module';
import { DocumentsModule } from './documents/documents.module';
import { HandoverModule } from './handover/handover.module';
import { CustomerLinksModule } from './customer-links/customer-links.module';
import { FollowUpsModule } from './follow-ups/follow-ups.module';
import { CustomerAreaModule } from './customer-area/customer-area.module';
import { BusinessDataModule } from './business-data/business-data.module';

@Module({
  imports: [
    ConfigModule.forRoot({ isGlobal: true, validate: validateEnv, cache: true }),
    TypeOrmModule.forRootAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService<EnvironmentVariables, true>) =>
        dataSourceOptions(config.get('DATABASE_URL', { infer: true })),
    }),
    CommandsModule,
    MailModule,
    AuthModule,
    InvitesModule,
    CustomersModule,
    VehiclesModule,
    JobsModule,
    ProductsModule,
    PinsModule,
    ReadingsModule,
    PassesModule,
    ChipsModule,
    SolventsModule,
    MaskingModule,
    TimersModule,
    ChecklistModule,
    ClimateModule,
    WorkspaceModule,
    BusinessesModule,
    UsersModule,
    QuotesModule,
    PaymentsModule,
    InvoicesModule,
    LedgerModule,
    PhotosModule,
    SignaturesModule,
    DocumentsModule,
    HandoverModule,
    CustomerLinksModule,
    FollowUpsModule,
    CustomerAreaModule,
    BusinessDataModule,
    AuditModule,
    SyncModule,
    HealthModule,
  ],
  providers: [
    // Registered here (not in main.ts) so tests that build AppModule get them too.
    { provide: APP_PIPE, useFactory: createValidationPipe },
    { provide: APP_FILTER, useClass: AllExceptionsFilter },
    { provide: APP_GUARD, useClass: JwtAuthGuard },
    { provide: APP_GUARD, useClass: RolesGuard },
  ],
})
export class AppModule {}
