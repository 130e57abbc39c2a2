/**
 * The key under which a card that names its item (an old way of the survey) tells the fields in
 * it what their findings' messages open with, so they are not repeated beside every field.
 */
import type { InjectionKey, Ref } from 'vue';

export const FINDING_PREFIX: InjectionKey<Readonly<Ref<string>>> = Symbol('finding-prefix');
