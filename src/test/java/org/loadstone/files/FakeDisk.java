package org.loadstone.files;

import java.io.IOException;
import java.nio.file.FileStore;
import java.nio.file.FileSystem;
import java.nio.file.Path;
import java.nio.file.PathMatcher;
import java.nio.file.WatchService;
import java.nio.file.attribute.UserPrincipalLookupService;
import java.nio.file.spi.FileSystemProvider;
import java.util.List;
import java.util.Set;
import java.util.concurrent.atomic.AtomicLong;

/**
 * A file system for tests that lies over a real folder and behaves like a disk Loadstone meets
 * in the field: without hard links (a FAT or exFAT stick: {@code link} fails as EPERM does) and
 * with a fixed number of bytes left, after which writes fail as on a full disk (and, when asked,
 * deleting a file gives its bytes back). Paths come from
 * {@link #path}; everything else is passed to the real file system.
 */
public final class FakeDisk extends FileSystem {
  private final FileSystem real;
  private final FakeProvider provider;
  final AtomicLong bytesLeft = new AtomicLong(Long.MAX_VALUE);
  volatile boolean links = true;
  /** Whether deleting a file's last name gives its bytes back to {@link #bytesLeft}. */
  volatile boolean freesOnDelete;
  /** How many times a hard link was refused. */
  final AtomicLong linksRefused = new AtomicLong();

  private FakeDisk(FileSystem real) {
    this.real = real;
    this.provider = new FakeProvider(this, real.provider());
  }

  /** @return a fake disk over the default file system, with links and no space limit */
  public static FakeDisk create() {
    return new FakeDisk(java.nio.file.FileSystems.getDefault());
  }

  /** Makes every hard link fail as on FAT or exFAT ({@code FileSystemException}, EPERM). */
  public FakeDisk withoutLinks() {
    links = false;
    return this;
  }

  /** Makes deleting a file's last name give its bytes back, as on a real disk. */
  public FakeDisk freeingOnDelete() {
    freesOnDelete = true;
    return this;
  }

  /** From now on, lets {@code bytes} more bytes be written, then fails as a full disk does. */
  public FakeDisk bytesLeft(long bytes) {
    bytesLeft.set(bytes);
    return this;
  }

  /** @return {@code realPath} on this disk */
  public Path path(Path realPath) {
    return new FakePath(this, realPath);
  }

  /** @return how many hard links were refused so far */
  public long linksRefused() {
    return linksRefused.get();
  }

  @Override public FileSystemProvider provider() {
    return provider;
  }

  @Override public void close() {
    // nothing is held open
  }

  @Override public boolean isOpen() {
    return true;
  }

  @Override public boolean isReadOnly() {
    return false;
  }

  @Override public String getSeparator() {
    return real.getSeparator();
  }

  @Override public Iterable<Path> getRootDirectories() {
    List<Path> roots = new java.util.ArrayList<>();
    real.getRootDirectories().forEach(r -> roots.add(path(r)));
    return roots;
  }

  @Override public Iterable<FileStore> getFileStores() {
    return real.getFileStores();
  }

  @Override public Set<String> supportedFileAttributeViews() {
    return real.supportedFileAttributeViews();
  }

  @Override public Path getPath(String first, String... more) {
    return path(real.getPath(first, more));
  }

  @Override public PathMatcher getPathMatcher(String syntaxAndPattern) {
    PathMatcher m = real.getPathMatcher(syntaxAndPattern);
    return p -> m.matches(FakePath.unwrap(p));
  }

  @Override public UserPrincipalLookupService getUserPrincipalLookupService() {
    return real.getUserPrincipalLookupService();
  }

  @Override public WatchService newWatchService() throws IOException {
    throw new UnsupportedOperationException("the fake disk has no watch service");
  }
}
