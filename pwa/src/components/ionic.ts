/**
 * Ionic's page and bar components, built here rather than taken from '@ionic/react'. Only
 * screens opened later use them (the first screens draw their header, body and tab bar with
 * plain elements); but @ionic/react is one module, loaded at every start, and a component
 * taken from it keeps its Ionic element in the startup code wherever it is used. Built here,
 * with the same factory and the same options as @ionic/react builds them, they and their
 * elements load with the screens that use them. ESLint refuses these names from
 * '@ionic/react' (eslint.config.mjs).
 *
 * IonButton is built plainly too: @ionic/react's adds `routerLink`, which the app never uses
 * (a link is a router `Link`).
 */
// eslint-disable-next-line no-restricted-imports -- types only: these are typed as @ionic/react's.
import type * as IonicReact from '@ionic/react';
import {
  IonButton as IonButtonElement,
  defineCustomElement as defineButton,
} from '@ionic/core/components/ion-button.js';
import {
  IonButtons as IonButtonsElement,
  defineCustomElement as defineButtons,
} from '@ionic/core/components/ion-buttons.js';
import {
  IonContent as IonContentElement,
  defineCustomElement as defineContent,
} from '@ionic/core/components/ion-content.js';
import {
  IonFooter as IonFooterElement,
  defineCustomElement as defineFooter,
} from '@ionic/core/components/ion-footer.js';
import {
  IonHeader as IonHeaderElement,
  defineCustomElement as defineHeader,
} from '@ionic/core/components/ion-header.js';
import {
  IonTitle as IonTitleElement,
  defineCustomElement as defineTitle,
} from '@ionic/core/components/ion-title.js';
import {
  IonToolbar as IonToolbarElement,
  defineCustomElement as defineToolbar,
} from '@ionic/core/components/ion-toolbar.js';
import { createComponent } from '@stencil/react-output-target/runtime';
import React from 'react';

export const IonButton = createComponent({
  tagName: 'ion-button',
  elementClass: IonButtonElement,
  react: React,
  events: { onIonFocus: 'ionFocus', onIonBlur: 'ionBlur' },
  defineCustomElement: defineButton,
}) as unknown as typeof IonicReact.IonButton;

export const IonButtons = createComponent({
  tagName: 'ion-buttons',
  elementClass: IonButtonsElement,
  react: React,
  events: {},
  defineCustomElement: defineButtons,
}) as unknown as typeof IonicReact.IonButtons;

export const IonContent = createComponent({
  tagName: 'ion-content',
  elementClass: IonContentElement,
  react: React,
  events: {
    onIonScrollStart: 'ionScrollStart',
    onIonScroll: 'ionScroll',
    onIonScrollEnd: 'ionScrollEnd',
  },
  defineCustomElement: defineContent,
}) as unknown as typeof IonicReact.IonContent;

export const IonFooter = createComponent({
  tagName: 'ion-footer',
  elementClass: IonFooterElement,
  react: React,
  events: {},
  defineCustomElement: defineFooter,
}) as unknown as typeof IonicReact.IonFooter;

export const IonHeader = createComponent({
  tagName: 'ion-header',
  elementClass: IonHeaderElement,
  react: React,
  events: {},
  defineCustomElement: defineHeader,
}) as unknown as typeof IonicReact.IonHeader;

export const IonTitle = createComponent({
  tagName: 'ion-title',
  elementClass: IonTitleElement,
  react: React,
  events: {},
  defineCustomElement: defineTitle,
}) as unknown as typeof IonicReact.IonTitle;

export const IonToolbar = createComponent({
  tagName: 'ion-toolbar',
  elementClass: IonToolbarElement,
  react: React,
  events: {},
  defineCustomElement: defineToolbar,
}) as unknown as typeof IonicReact.IonToolbar;
