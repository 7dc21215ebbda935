import { HttpStatus, Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import Stripe from 'stripe';
import type { EntityManager } from 'typeorm';
import { beforeCallingOut } from '../commands/call-out';
import { AppException } from '../common/app.exception';
import type { EnvironmentVariables } from '../config/env.validation';

/** The local fake's address, used outside production when no STRIPE_API_HOST is set. */
export const LOCAL_FAKE = { host: '127.0.0.1', port: 12111, protocol: 'http' as const };

const DEV_SECRETS = new Set(['sk_test_panelpass_local', 'whsec_panelpass_local_only']);

/**
 * The stripe SDK, configured from the settings. With STRIPE_API_HOST/PORT/PROTOCOL set it
 * talks to that address (the local fake in development and tests); unset, it talks to Stripe
 * in production and to the local fake elsewhere. In production the development key and
 * webhook secret are refused, so a forgotten setting cannot take or accept payments.
 */
@Injectable()
export class StripeGateway {
  private readonly sdk: Stripe;
  private readonly webhookSecret: string;
  private readonly problem: string | null;

  constructor(config: ConfigService<EnvironmentVariables, true>) {
    const production = config.get('NODE_ENV', { infer: true }) === 'production';
    const key = config.get('STRIPE_SECRET_KEY', { infer: true });
    this.webhookSecret = config.get('STRIPE_WEBHOOK_SECRET', { infer: true });
    const host = config.get('STRIPE_API_HOST', { infer: true });
    const port = config.get('STRIPE_API_PORT', { infer: true });
    const protocol = config.get('STRIPE_API_PROTOCOL', { infer: true });
    const endpoint = host
      ? { host, ...(port ? { port } : {}), ...(protocol ? { protocol } : {}) }
      : production
        ? {}
        : LOCAL_FAKE;
    this.sdk = new Stripe(key, {
      ...endpoint,
      maxNetworkRetries: config.get('STRIPE_MAX_NETWORK_RETRIES', { infer: true }),
      timeout: config.get('STRIPE_TIMEOUT_MS', { infer: true }),
      telemetry: false,
    });
    this.problem =
      production && (DEV_SECRETS.has(key) || DEV_SECRETS.has(this.webhookSecret))
        ? 'Card payments are not set up on this server (STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET)'
        : null;
    if (this.problem) new Logger('StripeGateway').warn(this.problem);
  }

  /**
   * The SDK, for a call to the provider made by a command in the transaction `m`: never from a
   * run the sync push may repeat (see `beforeCallingOut`; the commands that call it are marked
   * `reachesOutside`).
   */
  clientIn(m: EntityManager): Stripe {
    beforeCallingOut(m);
    return this.sdk;
  }

  /** 503 when card payments cannot be taken here. */
  checkUsable(): void {
    if (this.problem) {
      throw new AppException(
        HttpStatus.SERVICE_UNAVAILABLE,
        'payments-not-configured',
        this.problem,
      );
    }
  }

  /** The event, when the body is exactly what Stripe signed with our endpoint's secret; else 400. */
  verify(raw: Buffer, header: string | undefined): Stripe.Event {
    if (this.problem) this.checkUsable();
    try {
      return Stripe.webhooks.constructEvent(raw, header ?? '', this.webhookSecret);
    } catch (e) {
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'bad-signature',
        `The webhook's signature does not match: ${e instanceof Error ? e.message : 'not signed'}`,
      );
    }
  }

  /** A Stripe failure in our one error shape. */
  static failure(e: unknown): AppException {
    if (e instanceof Stripe.errors.StripeIdempotencyError) {
      return new AppException(
        HttpStatus.CONFLICT,
        'request-changed',
        'This payment request was first made with other details (the amount due has changed since); make a new request',
      );
    }
    if (e instanceof Stripe.errors.StripeError) {
      if (e.type === 'StripeConnectionError' || (e.statusCode ?? 500) >= 500) {
        return new AppException(
          HttpStatus.BAD_GATEWAY,
          'payment-provider-unreachable',
          'The card payment service did not answer; try again (trying again never charges twice)',
        );
      }
      return new AppException(
        HttpStatus.BAD_GATEWAY,
        'payment-provider-refused',
        `The card payment service refused: ${e.message}`,
        { code: e.code ?? null },
      );
    }
    return new AppException(
      HttpStatus.BAD_GATEWAY,
      'payment-provider-unreachable',
      'The card payment service did not answer; try again (trying again never charges twice)',
    );
  }
}
