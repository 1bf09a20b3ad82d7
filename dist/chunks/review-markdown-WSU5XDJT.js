#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  COMMENT_LIMIT,
  REVIEW_MARKER,
  renderReviewMarkdown
} from "./chunk-MEL5VBEP.js";
import "./chunk-FZSY7OIF.js";
import "./chunk-D7CL2H7J.js";
import "./chunk-AAUUFJV7.js";
import "./chunk-FUJ7I5KY.js";
export {
  COMMENT_LIMIT,
  REVIEW_MARKER,
  renderReviewMarkdown
};
