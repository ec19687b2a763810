//go:build unix

package main

import "syscall"

// umask is the process's file-mode mask (read by setting and restoring it).
func umask() uint32 {
	m := syscall.Umask(0)
	syscall.Umask(m)
	return uint32(m)
}
