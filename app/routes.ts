import { type RouteConfig, index, prefix, route } from "@react-router/dev/routes";

/**
 * Every URL of the app, as plain data. UI routes live in routes/, JSON resource routes in
 * routes/api/ under the /api prefix. The splat route must stay last: it answers 404.
 */
export default [
  index("routes/home.tsx"),
  // Accounts and labs (issue 5).
  route("sign-in", "routes/sign-in.tsx"),
  route("sign-in/verify", "routes/sign-in-verify.tsx"),
  route("sign-in/magic", "routes/sign-in-magic.ts"),
  route("welcome", "routes/welcome.tsx"),
  route("sign-out", "routes/sign-out.ts"),
  route("labs", "routes/labs.tsx"),
  route("labs/:labSlug", "routes/lab.tsx"),
  route("labs/:labSlug/members", "routes/lab-members.tsx"),
  route("labs/:labSlug/audit", "routes/lab-audit.tsx"),
  route("invitations/:token", "routes/invitation.tsx"),
  route("account", "routes/account.tsx"),
  route("admin", "routes/admin.tsx"),
  // Networks (issue 6).
  route("networks", "routes/networks-home.ts"),
  route("labs/:labSlug/networks", "routes/networks.tsx"),
  route("labs/:labSlug/networks/new", "routes/networks-new.tsx"),
  route("labs/:labSlug/networks/:networkId", "routes/networks-show.tsx"),
  route("labs/:labSlug/networks/:networkId/edit", "routes/networks-edit.tsx"),
  route("labs/:labSlug/networks/:networkId/versions", "routes/networks-versions.tsx"),
  route("labs/:labSlug/networks/:networkId/download/:file", "routes/networks-download.ts"),
  // Analyses (issue 7).
  route("analyses", "routes/analyses-home.ts"),
  route("labs/:labSlug/analyses", "routes/analyses.tsx"),
  route("labs/:labSlug/analyses/compare", "routes/analyses-compare.tsx"),
  route("labs/:labSlug/analyses/:analysisId", "routes/analysis.tsx"),
  route("labs/:labSlug/analyses/:analysisId/export/:file", "routes/analysis-export.ts"),
  route("labs/:labSlug/networks/:networkId/analyse", "routes/analyses-new.tsx"),
  route("share/:token", "routes/share.tsx"),
  route("share/:token/export/:file", "routes/share-export.ts"),
  ...prefix("api", [
    route("health", "routes/api/health.ts"),
    route("openapi.json", "routes/api/openapi.ts"),
    // Accounts and labs (issue 5): bearer token or session cookie.
    route("me", "routes/api/me.ts"),
    route("labs", "routes/api/labs.ts"),
    route("labs/:labSlug", "routes/api/lab.ts"),
    route("labs/:labSlug/members", "routes/api/lab-members.ts"),
    route("labs/:labSlug/audit", "routes/api/lab-audit.ts"),
    // Networks (issue 6).
    route("labs/:labSlug/networks", "routes/api/networks.ts"),
    route("labs/:labSlug/networks/:networkId", "routes/api/networks-item.ts"),
    route("labs/:labSlug/networks/:networkId/versions", "routes/api/networks-versions.ts"),
    route("labs/:labSlug/networks/:networkId/versions/:number", "routes/api/networks-version.ts"),
    // Analyses and scans (issue 7).
    route("labs/:labSlug/analyses", "routes/api/analyses.ts"),
    route("labs/:labSlug/analyses/:analysisId", "routes/api/analyses-item.ts"),
    route("labs/:labSlug/analyses/:analysisId/cancel", "routes/api/analyses-cancel.ts"),
    route("labs/:labSlug/analyses/:analysisId/scans", "routes/api/scans.ts"),
    route("labs/:labSlug/scans/:scanId", "routes/api/scans-item.ts"),
    route("labs/:labSlug/scans/:scanId/cancel", "routes/api/scans-cancel.ts"),
    // Keep last in the prefix: every other /api/ path answers the JSON error shape.
    route("*", "routes/api/not-found.ts"),
  ]),
  route("*", "routes/not-found.tsx"),
] satisfies RouteConfig;
