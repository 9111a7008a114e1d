import '@fontsource/manrope/latin-400.css';
import '@fontsource/manrope/latin-600.css';
import '@fontsource/manrope/latin-700.css';
import { mountApp } from '@loomwright/shared/ui';
import { AppProviders } from 'src/app/providers';
import { AppRouter } from 'src/app/router';

mountApp(AppProviders, AppRouter);
