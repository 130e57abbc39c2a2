import type { Component } from 'vue';

/** One main-navigation entry: a named route, its label and icon, and the path prefix its pages share. */
export interface NavigationEntry {
  route: string;
  label: string;
  icon: Component;
  section: string;
}
