#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  COMMENT_LIMIT,
  REVIEW_MARKER,
  SUMMARY_LIMIT,
  measureBytes,
  measureCharacters,
  renderReviewMarkdown,
  renderReviewSummary
} from "./chunk-5MDTJWUT.js";
import "./chunk-E2S32G3V.js";
import "./chunk-MYUGBT5N.js";
import "./chunk-WEHQQR5J.js";
import "./chunk-OLV4RVGO.js";
import "./chunk-7H6MHGDI.js";
import "./chunk-D7CL2H7J.js";
import "./chunk-ACAADDFF.js";
import "./chunk-FUJ7I5KY.js";
export {
  COMMENT_LIMIT,
  REVIEW_MARKER,
  SUMMARY_LIMIT,
  measureBytes,
  measureCharacters,
  renderReviewMarkdown,
  renderReviewSummary
};
