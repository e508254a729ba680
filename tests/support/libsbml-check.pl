#!/usr/bin/perl
# Reads SBML on standard input with libSBML (Perl bindings) and runs its consistency checks.
# Prints one JSON object: the libSBML version, the number of warnings and every error (severity error or fatal).
use strict;
use warnings;
use LibSBML;

local $/;
my $text = <STDIN>;
my $doc = LibSBML::readSBMLFromString($text);
my $readErrors = $doc->getNumErrors();
$doc->checkConsistency() if $readErrors == 0;
my @items;
my $warnings = 0;
for (my $i = 0; $i < $doc->getNumErrors(); $i++) {
  my $e = $doc->getError($i);
  if ($e->getSeverity() < $LibSBML::LIBSBML_SEV_ERROR) { $warnings++; next; }
  my $msg = $e->getMessage();
  $msg =~ s/\\/\\\\/g; $msg =~ s/"/\\"/g; $msg =~ s/\n/ /g;
  push @items, sprintf('{"severity":%d,"line":%d,"id":%d,"message":"%s"}', $e->getSeverity(), $e->getLine(), $e->getErrorId(), $msg);
}
printf('{"version":"%s","warnings":%d,"errors":[%s]}' . "\n", LibSBML::getLibSBMLDottedVersion(), $warnings, join(',', @items));
