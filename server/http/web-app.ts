import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import express, { type Express, type Request, type Response } from 'express';

function htmlFiles(dir: string, base = dir, out: string[] = []): string[] {
  let entries: fs.Dirent[];
  try {
    entries = fs.readdirSync(dir, { withFileTypes: true });
  } catch {
    return out;
  }
  for (const e of entries) {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) {
      if (e.name !== '_expo' && e.name !== 'assets') htmlFiles(full, base, out);
    } else if (e.name.endsWith('.html')) out.push(path.relative(base, full));
  }
  return out;
}

/** CSP source expressions ('sha256-…') for every inline <script> body in the exported HTML. */
export function inlineScriptHashes(distDir: string): string[] {
  const hashes = new Set<string>();
  for (const rel of htmlFiles(distDir)) {
    const html = fs.readFileSync(path.join(distDir, rel), 'utf8');
    for (const m of html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)) {
      if (/\bsrc\s*=/i.test(m[1]) || m[2].length === 0) continue;
      hashes.add(`'sha256-${crypto.createHash('sha256').update(m[2], 'utf8').digest('base64')}'`);
    }
  }
  return [...hashes].sort();
}

type Pattern = { segments: string[]; file: string; score: number };

/** Expo's static output names dynamic routes [param].html and catch-alls [...rest].html. */
function dynamicPatterns(files: readonly string[]): Pattern[] {
  const patterns: Pattern[] = [];
  for (const rel of files) {
    if (!rel.includes('[')) continue;
    let route = rel.replace(/\.html$/, '');
    if (route.endsWith('/index')) route = route.slice(0, -'/index'.length);
    const segments = route.split('/').filter((s) => !/^\(.*\)$/.test(s));
    // More literal segments first; catch-alls last.
    const score = segments.reduce((s, seg) => s + (seg.startsWith('[...') ? 0 : seg.startsWith('[') ? 1 : 10), 0);
    patterns.push({ segments, file: rel, score });
  }
  return patterns.sort((a, b) => b.score - a.score);
}

function matches(p: Pattern, parts: string[]): boolean {
  for (let i = 0; i < p.segments.length; i++) {
    const seg = p.segments[i];
    if (seg.startsWith('[...')) return parts.length > i;
    if (i >= parts.length) return false;
    if (!seg.startsWith('[') && seg !== parts[i]) return false;
  }
  return parts.length === p.segments.length;
}

/**
 * Serves the exported web app: files as they are, /a/b as a/b.html or a/b/index.html, dynamic
 * routes through their [param].html, else +not-found.html (404) or index.html.
 */
export function mountWebApp(app: Express, distDir: string): void {
  const hasDist = fs.existsSync(path.join(distDir, 'index.html'));
  if (!hasDist) {
    app.get('/{*splat}', (_req, res) => {
      res
        .status(200)
        .type('text/plain')
        .send('Lagline API is running. The web app has not been built yet: run `npx expo export --platform web`.\n');
    });
    return;
  }
  app.use(express.static(distDir, { index: false, redirect: false, fallthrough: true, dotfiles: 'ignore' }));
  // Route groups such as (app)/ do not appear in URLs; a file outside a group wins.
  const files = htmlFiles(distDir).map((f) => f.replace(/\\/g, '/'));
  const pages = new Map<string, string>();
  for (const rel of [...files].sort((a, b) => a.split('(').length - b.split('(').length)) {
    const key = rel.split('/').filter((seg) => !/^\(.*\)$/.test(seg)).join('/');
    if (!pages.has(key)) pages.set(key, rel);
  }
  const patterns = dynamicPatterns(files);
  const notFound = fs.existsSync(path.join(distDir, '+not-found.html')) ? '+not-found.html' : null;
  const send = (res: Response, rel: string, status = 200) => {
    res.status(status).type('html').sendFile(path.join(distDir, rel), { dotfiles: 'allow' });
  };
  app.get('/{*splat}', (req: Request, res: Response) => {
    const parts = req.path.split('/').filter(Boolean).map((p) => {
      try {
        return decodeURIComponent(p);
      } catch {
        return p;
      }
    });
    if (!parts.some((p) => p === '..' || p === '.' || p.includes('/') || p.includes('\\'))) {
      const route = parts.join('/');
      for (const candidate of route ? [`${route}.html`, `${route}/index.html`] : ['index.html']) {
        const file = pages.get(candidate);
        if (file) return send(res, file);
      }
    }
    const hit = patterns.find((p) => matches(p, parts));
    if (hit) return send(res, hit.file);
    if (notFound) return send(res, notFound, 404);
    send(res, 'index.html');
  });
}
