// The test run shares two cores between PostgreSQL, Redis and many test files: give the
// testing-library's findBy/waitFor more than their default second before they give up.
import { configure } from '@testing-library/dom';

configure({ asyncUtilTimeout: 10_000 });
