package org.loadstone;

public final class Main {
  public static void main(String[] args) {
    System.out.println("loadstone");
  }
}
