package org.loadstone.files;

import java.io.IOException;
import java.net.URI;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.WatchEvent;
import java.nio.file.WatchKey;
import java.nio.file.WatchService;

/** A path of a {@link FakeDisk}: the real path underneath, answered through the fake's provider. */
final class FakePath implements Path {
  private final FakeDisk disk;
  final Path real;

  FakePath(FakeDisk disk, Path real) {
    this.disk = disk;
    this.real = real;
  }

  private Path wrap(Path p) {
    return p == null ? null : new FakePath(disk, p);
  }

  static Path unwrap(Path p) {
    if (!(p instanceof FakePath f)) {
      throw new java.nio.file.ProviderMismatchException("not a path of the fake disk: " + p);
    }
    return f.real;
  }

  @Override public FakeDisk getFileSystem() {
    return disk;
  }

  @Override public boolean isAbsolute() {
    return real.isAbsolute();
  }

  @Override public Path getRoot() {
    return wrap(real.getRoot());
  }

  @Override public Path getFileName() {
    return wrap(real.getFileName());
  }

  @Override public Path getParent() {
    return wrap(real.getParent());
  }

  @Override public int getNameCount() {
    return real.getNameCount();
  }

  @Override public Path getName(int index) {
    return wrap(real.getName(index));
  }

  @Override public Path subpath(int beginIndex, int endIndex) {
    return wrap(real.subpath(beginIndex, endIndex));
  }

  @Override public boolean startsWith(Path other) {
    return other instanceof FakePath f && real.startsWith(f.real);
  }

  @Override public boolean endsWith(Path other) {
    return other instanceof FakePath f && real.endsWith(f.real);
  }

  @Override public Path normalize() {
    return wrap(real.normalize());
  }

  @Override public Path resolve(Path other) {
    return wrap(real.resolve(unwrap(other)));
  }

  @Override public Path resolve(String other) {
    return wrap(real.resolve(other));
  }

  @Override public Path relativize(Path other) {
    return wrap(real.relativize(unwrap(other)));
  }

  @Override public URI toUri() {
    return real.toUri();
  }

  @Override public Path toAbsolutePath() {
    return wrap(real.toAbsolutePath());
  }

  @Override public Path toRealPath(LinkOption... options) throws IOException {
    return wrap(real.toRealPath(options));
  }

  @Override public WatchKey register(WatchService watcher, WatchEvent.Kind<?>[] events,
      WatchEvent.Modifier... modifiers) {
    throw new UnsupportedOperationException("the fake disk has no watch service");
  }

  @Override public int compareTo(Path other) {
    return real.compareTo(unwrap(other));
  }

  @Override public boolean equals(Object o) {
    return o instanceof FakePath f && f.disk == disk && f.real.equals(real);
  }

  @Override public int hashCode() {
    return real.hashCode();
  }

  @Override public String toString() {
    return real.toString();
  }
}
