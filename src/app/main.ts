import { SCHEMA_SETTINGS } from './lib/jitlessSchemas.ts';
import { mount } from 'svelte';
import App from './App.svelte';
import './app.css';

// Using the settings keeps their module (and so the setting) in the bundle, ahead of every schema.
if (!SCHEMA_SETTINGS.jitless) throw new Error('zod settings: expected jitless parsing, got compiled parsers');
mount(App, { target: document.getElementById('app')! });
